using System.Security.Claims;

namespace GelDispense.Service.Security;

/// <summary>
/// Claim names shared by API keys and JWTs, so the rest of the service reads a caller the same way whichever
/// scheme admitted it. A site's identity provider issues tokens with "role" and, for stations, "station_id".
/// </summary>
public static class GelDispenseClaims
{
    public const string KeyId = "key_id";
    public const string Role = "role";
    public const string StationId = "station_id";
    public const string Subject = "sub";

    /// <summary>The id events record as the actor: the key id, or the token's subject.</summary>
    public static string Actor(ClaimsPrincipal user) =>
        user.FindFirstValue(KeyId) ?? user.FindFirstValue(Subject) ?? "";

    /// <summary>
    /// Throws PERMISSION_DENIED when a station caller acts for another station. Callers in other roles reach this
    /// only through policies that already admit them for every station.
    /// </summary>
    public static void RequireStation(ClaimsPrincipal user, string stationId, string field)
    {
        if (user.IsInRole(Roles.Admin) || !user.IsInRole(Roles.Station))
        {
            return;
        }

        var own = user.FindFirstValue(StationId) ?? "";
        if (!string.Equals(own, stationId, StringComparison.Ordinal))
        {
            throw Errors.ApiException.Forbidden(field, stationId, $"this station key may act only for station '{own}'");
        }
    }
}
