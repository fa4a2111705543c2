using System.Collections.Concurrent;
using Dapper;

namespace GelDispense.Service.Storage;

/// <summary>
/// The api_keys table. Rows are inserted and stamped as revoked, never deleted. A key found by its prefix is kept in
/// memory for <paramref name="lookupCachePeriod"/> (<c>Auth:KeyCacheSeconds</c>; zero reads the table on every call),
/// so each key is read at most once per period per process instead of on every request. A revocation through this
/// process drops the key at once; another replica sharing the database keeps admitting it for at most the period.
/// Expiry is judged on every call from the cached row, so it is not delayed.
/// </summary>
public sealed class ApiKeyStore(IDatabase database, TimeProvider time, TimeSpan lookupCachePeriod)
{
    private const string Columns = "id, prefix, key_hash, role, station_id, label, created_at, expires_at, revoked_at";

    static ApiKeyStore() => DefaultTypeMap.MatchNamesWithUnderscores = true;

    public async Task AddAsync(ApiKeyRow row, CancellationToken cancellationToken)
    {
        using var turn = await database.EnterWriteAsync(cancellationToken);
        await using var connection = await database.OpenAsync(cancellationToken);
        await connection.ExecuteAsync(new CommandDefinition(
            $"INSERT INTO api_keys ({Columns}) VALUES (@Id, @Prefix, @KeyHash, @Role, @StationId, @Label, @CreatedAt, @ExpiresAt, @RevokedAt)", row, cancellationToken: cancellationToken));
    }

    /// <summary>
    /// Adds <paramref name="row"/> only when the table is empty, in one transaction: of several replicas starting on
    /// one new database, exactly one issues the first admin key.
    /// </summary>
    public async Task<bool> TryAddFirstAsync(ApiKeyRow row, CancellationToken cancellationToken)
    {
        using var turn = await database.EnterWriteAsync(cancellationToken);
        await using var connection = await database.OpenAsync(cancellationToken);
        await using var transaction = await connection.BeginTransactionAsync(cancellationToken);
        // The event_sequence row lock serialises this check against another replica doing the same.
        await connection.ExecuteAsync(new CommandDefinition("UPDATE event_sequence SET last_seq = last_seq WHERE id = 1", transaction: transaction, cancellationToken: cancellationToken));
        if (await connection.ExecuteScalarAsync<long>(new CommandDefinition("SELECT COUNT(*) FROM api_keys", transaction: transaction, cancellationToken: cancellationToken)) > 0)
        {
            return false;
        }

        await connection.ExecuteAsync(new CommandDefinition(
            $"INSERT INTO api_keys ({Columns}) VALUES (@Id, @Prefix, @KeyHash, @Role, @StationId, @Label, @CreatedAt, @ExpiresAt, @RevokedAt)",
            row, transaction, cancellationToken: cancellationToken));
        await transaction.CommitAsync(cancellationToken);
        return true;
    }

    // Only keys that exist are kept: at most one entry per key ever presented to this process.
    private readonly ConcurrentDictionary<string, (ApiKeyRow Row, DateTimeOffset ReadAt)> _byPrefix = new(StringComparer.Ordinal);

    // Bumped by every revocation here: a lookup that read the row before a revocation committed must not cache it after
    // the revocation has cleared the cache.
    private long _revocations;

    public async Task<ApiKeyRow?> FindByPrefixAsync(string prefix, CancellationToken cancellationToken)
    {
        var now = time.GetUtcNow();
        if (_byPrefix.TryGetValue(prefix, out var cached) && now - cached.ReadAt < lookupCachePeriod)
        {
            return cached.Row;
        }

        var revocations = Interlocked.Read(ref _revocations);
        await using var connection = await database.OpenAsync(cancellationToken);
        var row = await connection.QuerySingleOrDefaultAsync<ApiKeyRow>(new CommandDefinition($"SELECT {Columns} FROM api_keys WHERE prefix = @prefix", new { prefix }, cancellationToken: cancellationToken));
        if (row is not null && lookupCachePeriod > TimeSpan.Zero)
        {
            _byPrefix[prefix] = (row, now);
            if (Interlocked.Read(ref _revocations) != revocations)
            {
                _byPrefix.TryRemove(prefix, out _);
            }
        }

        return row;
    }

    public async Task<ApiKeyRow?> FindAsync(string id, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        return await connection.QuerySingleOrDefaultAsync<ApiKeyRow>(new CommandDefinition($"SELECT {Columns} FROM api_keys WHERE id = @id", new { id }, cancellationToken: cancellationToken));
    }

    public async Task<IReadOnlyList<ApiKeyRow>> ListAsync(CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        return [.. await connection.QueryAsync<ApiKeyRow>(new CommandDefinition($"SELECT {Columns} FROM api_keys ORDER BY created_at DESC, id", cancellationToken: cancellationToken))];
    }

    /// <summary>Stamps the revocation time once; a second revoke keeps the first time.</summary>
    public async Task RevokeAsync(string id, DateTimeOffset at, CancellationToken cancellationToken)
    {
        using var turn = await database.EnterWriteAsync(cancellationToken);
        await using var connection = await database.OpenAsync(cancellationToken);
        await connection.ExecuteAsync(new CommandDefinition(
            "UPDATE api_keys SET revoked_at = @at WHERE id = @id AND revoked_at IS NULL", new { id, at = TimeText.Format(at) }, cancellationToken: cancellationToken));
        Interlocked.Increment(ref _revocations);
        foreach (var entry in _byPrefix.Where(entry => entry.Value.Row.Id == id))
        {
            _byPrefix.TryRemove(entry.Key, out _);
        }
    }
}
