using System.Data.Common;
using Dapper;

namespace GelDispense.Service.Storage;

/// <summary>Custom reagents and reagent lots, each stored as protobuf JSON of its contract message.</summary>
public sealed class ReagentStore(IDatabase database)
{
    /// <summary>Inserts a reagent; false when the id is taken.</summary>
    public Task<bool> TryAddReagentAsync(string id, string body, DateTimeOffset at, CancellationToken cancellationToken) =>
        TryInsertAsync(
            "INSERT INTO reagents (id, body, created_at) VALUES (@id, @body, @at)",
            new { id, body, at = TimeText.Format(at) }, cancellationToken);

    public async Task<IReadOnlyList<string>> ReagentBodiesAsync(CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        return [.. await connection.QueryAsync<string>(new CommandDefinition("SELECT body FROM reagents ORDER BY id", cancellationToken: cancellationToken))];
    }

    /// <summary>The stored reagents among <paramref name="ids"/>; ids without a stored reagent are left out.</summary>
    public async Task<IReadOnlyList<string>> ReagentBodiesAsync(IReadOnlyCollection<string> ids, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        return [.. await connection.QueryAsync<string>(new CommandDefinition(
            $"SELECT body FROM reagents WHERE {database.AnyOf("id", "ids")} ORDER BY id", new { ids = ids.ToArray() }, cancellationToken: cancellationToken))];
    }

    public async Task<string?> ReagentBodyAsync(string id, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        return await connection.QuerySingleOrDefaultAsync<string>(new CommandDefinition("SELECT body FROM reagents WHERE id = @id", new { id }, cancellationToken: cancellationToken));
    }

    /// <summary>Inserts a lot; false when the reagent already has a lot with this id.</summary>
    public Task<bool> TryAddLotAsync(string reagentId, string lotId, string expiresOn, string body, DateTimeOffset at, CancellationToken cancellationToken) =>
        TryInsertAsync(
            "INSERT INTO reagent_lots (reagent_id, lot_id, expires_on, body, created_at) VALUES (@reagentId, @lotId, @expiresOn, @body, @at)",
            new { reagentId, lotId, expiresOn, body, at = TimeText.Format(at) }, cancellationToken);

    public async Task<IReadOnlyList<string>> LotBodiesAsync(string reagentId, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        return [.. await connection.QueryAsync<string>(new CommandDefinition(
            "SELECT body FROM reagent_lots WHERE reagent_id = @reagentId ORDER BY expires_on, lot_id", new { reagentId }, cancellationToken: cancellationToken))];
    }

    private async Task<bool> TryInsertAsync(string sql, object parameters, CancellationToken cancellationToken)
    {
        using var turn = await database.EnterWriteAsync(cancellationToken);
        await using var connection = await database.OpenAsync(cancellationToken);
        try
        {
            await connection.ExecuteAsync(new CommandDefinition(sql, parameters, cancellationToken: cancellationToken));
            return true;
        }
        catch (DbException e) when (database.IsConflict(e))
        {
            return false;
        }
    }
}
