namespace GelDispense.Service.Storage;

/// <summary>One row of api_keys: never the key itself, only its hash and lookup prefix.</summary>
public sealed class ApiKeyRow
{
    public string Id { get; init; } = "";
    public string Prefix { get; init; } = "";
    public string KeyHash { get; init; } = "";
    public string Role { get; init; } = "";
    public string StationId { get; init; } = "";
    public string Label { get; init; } = "";
    public string CreatedAt { get; init; } = "";
    public string? ExpiresAt { get; init; }
    public string? RevokedAt { get; init; }

    /// <summary>In force at <paramref name="at"/>: not revoked and not past its expiry.</summary>
    public bool InForce(DateTimeOffset at) =>
        RevokedAt is null && (ExpiresAt is null || TimeText.Parse(ExpiresAt) > at);
}
