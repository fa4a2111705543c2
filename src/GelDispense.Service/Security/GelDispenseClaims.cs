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
}
