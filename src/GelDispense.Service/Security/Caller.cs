using System.Security.Claims;
using GelDispense.Service.Errors;

namespace GelDispense.Service.Security;

/// <summary>
/// Who is calling, as the batch ledger needs it: the actor id events record, and the one station a station caller
/// may act for (null for callers whose policy admits them for every station).
/// </summary>
public sealed record Caller(string ActorId, string? OwnStationId)
{
    public static Caller From(ClaimsPrincipal user) =>
        new(GelDispenseClaims.Actor(user),
            user.IsInRole(Roles.Station) && !user.IsInRole(Roles.Admin) ? user.FindFirstValue(GelDispenseClaims.StationId) ?? "" : null);

    /// <summary>Throws PERMISSION_DENIED when a station caller acts for another station.</summary>
    public void RequireStation(string stationId, string field)
    {
        if (OwnStationId is { } own && !string.Equals(own, stationId, StringComparison.Ordinal))
        {
            throw ApiException.Forbidden(field, stationId, $"this key may act only for station '{own}'");
        }
    }
}
