using System.Security.Cryptography;
using System.Text.RegularExpressions;
using GelDispense.Chemistry.Errors;
using GelDispense.Service.Storage;

namespace GelDispense.Service.Security;

/// <summary>Issues keys (the secret leaves only in the return value), checks presented keys, and revokes them.</summary>
public sealed partial class ApiKeyIssuer(ApiKeyStore store, RandomNumberGenerator random, TimeProvider time)
{
    [GeneratedRegex("^[A-Za-z0-9][A-Za-z0-9._-]{0,63}$")]
    private static partial Regex StationPattern();

    /// <summary>Validates the request, stores the hash and returns the row with the key, which is not kept.</summary>
    public async Task<(ApiKeyRow Row, string Key)> IssueAsync(
        string role, string stationId, DateTimeOffset? expiresAt, string label, CancellationToken cancellationToken)
    {
        var (row, key) = NewKey(role, stationId, expiresAt, label);
        await store.AddAsync(row, cancellationToken);
        return (row, key);
    }

    /// <summary>The first admin key of an empty database, or null when keys exist already.</summary>
    public async Task<(ApiKeyRow Row, string Key)?> IssueBootstrapAsync(CancellationToken cancellationToken)
    {
        var (row, key) = NewKey(Roles.Admin, "", null, "bootstrap admin key");
        return await store.TryAddFirstAsync(row, cancellationToken) ? (row, key) : null;
    }

    /// <summary>The key row when <paramref name="key"/> is a key in force; otherwise null and why.</summary>
    public async Task<(ApiKeyRow? Row, string Refusal)> CheckAsync(string key, CancellationToken cancellationToken)
    {
        var prefix = ApiKeySecret.Prefix(key);
        if (prefix is null)
        {
            return (null, "not a well-formed key");
        }

        var row = await store.FindByPrefixAsync(prefix, cancellationToken);
        if (row is null || !ApiKeySecret.Matches(key, row.KeyHash))
        {
            return (null, "unknown key");
        }

        if (row.RevokedAt is not null)
        {
            return (null, $"key {row.Id} is revoked");
        }

        return row.InForce(time.GetUtcNow()) ? (row, "") : (null, $"key {row.Id} expired");
    }

    private (ApiKeyRow Row, string Key) NewKey(string role, string stationId, DateTimeOffset? expiresAt, string label)
    {
        var now = time.GetUtcNow();
        Validate(role, stationId, expiresAt, label, now);
        var key = ApiKeySecret.NewKey(random);
        var idBytes = new byte[8];
        random.GetBytes(idBytes);
        var row = new ApiKeyRow
        {
            Id = "key-" + Convert.ToHexStringLower(idBytes),
            Prefix = ApiKeySecret.Prefix(key)!,
            KeyHash = ApiKeySecret.Hash(key),
            Role = role,
            StationId = stationId,
            Label = label,
            CreatedAt = TimeText.Format(now),
            ExpiresAt = expiresAt is { } expires ? TimeText.Format(expires) : null,
        };
        return (row, key);
    }

    private static void Validate(string role, string stationId, DateTimeOffset? expiresAt, string label, DateTimeOffset now)
    {
        var errors = new List<InputError>();
        if (!Roles.All.Contains(role))
        {
            errors.Add(new InputError("role", Mapping.RecipeMapping.Clip(role), $"unknown role; use one of {string.Join(", ", Roles.All)}"));
        }
        else if (role == Roles.Station && !StationPattern().IsMatch(stationId))
        {
            errors.Add(new InputError("stationId", Mapping.RecipeMapping.Clip(stationId), "a station key names its station: 1 to 64 letters, digits, dots, dashes or underscores"));
        }
        else if (role != Roles.Station && stationId.Length > 0)
        {
            errors.Add(new InputError("stationId", Mapping.RecipeMapping.Clip(stationId), "only a station key names a station"));
        }

        if (expiresAt is { } expires && expires <= now)
        {
            errors.Add(new InputError("expiresAt", TimeText.Format(expires), "an expiry must lie in the future"));
        }

        if (label.Length > 200)
        {
            errors.Add(new InputError("label", Mapping.RecipeMapping.Clip(label), "a label has at most 200 characters"));
        }

        if (errors.Count > 0)
        {
            throw new InvalidInputException(errors);
        }
    }
}
