using System.Data.Common;
using System.Reflection;
using Dapper;

namespace GelDispense.Service.Storage;

/// <summary>
/// Applies the numbered scripts under Storage/Migrations/&lt;engine&gt;/ (embedded resources named NNNN_name.sql)
/// in order, each in its own transaction together with its row in schema_version.
/// </summary>
public static class MigrationRunner
{
    public static async Task ApplyAsync(Database database, TimeProvider time, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenRawAsync(cancellationToken);
        // One transaction for everything: DDL is transactional on both engines, so a failed script leaves no trace.
        await using var transaction = await connection.BeginTransactionAsync(cancellationToken);
        await connection.ExecuteAsync(new CommandDefinition(database.MigrationLockSql, transaction: transaction, cancellationToken: cancellationToken));
        await connection.ExecuteAsync(new CommandDefinition(
            "CREATE TABLE IF NOT EXISTS schema_version (version INTEGER PRIMARY KEY, name TEXT NOT NULL, applied_at TEXT NOT NULL)",
            transaction: transaction, cancellationToken: cancellationToken));
        foreach (var (version, name, sql) in Scripts(database.Engine))
        {
            var applied = await connection.ExecuteScalarAsync<long>(new CommandDefinition(
                "SELECT COUNT(*) FROM schema_version WHERE version = @version", new { version }, transaction, cancellationToken: cancellationToken));
            if (applied == 0)
            {
                await connection.ExecuteAsync(new CommandDefinition(sql, transaction: transaction, cancellationToken: cancellationToken));
                await connection.ExecuteAsync(new CommandDefinition(
                    "INSERT INTO schema_version (version, name, applied_at) VALUES (@version, @name, @at)",
                    new { version, name, at = TimeText.Format(time.GetUtcNow()) }, transaction, cancellationToken: cancellationToken));
            }
        }

        await transaction.CommitAsync(cancellationToken);
    }

    /// <summary>The engine's scripts ordered by number.</summary>
    public static IReadOnlyList<(int Version, string Name, string Sql)> Scripts(string engine)
    {
        var assembly = typeof(MigrationRunner).Assembly;
        var prefix = $"{assembly.GetName().Name}.Storage.Migrations.{engine}.";
        return [.. assembly.GetManifestResourceNames()
            .Where(n => n.StartsWith(prefix, StringComparison.Ordinal) && n.EndsWith(".sql", StringComparison.Ordinal))
            .Select(n => n[prefix.Length..^4])
            .Select(n => (Version: int.Parse(n[..4], System.Globalization.CultureInfo.InvariantCulture), Name: n, Sql: Read(assembly, prefix + n + ".sql")))
            .OrderBy(s => s.Version)];
    }

    private static string Read(Assembly assembly, string resource)
    {
        using var stream = assembly.GetManifestResourceStream(resource)
            ?? throw new InvalidOperationException($"Migration resource {resource} is missing.");
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    }
}
