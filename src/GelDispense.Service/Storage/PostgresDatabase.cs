using System.Data.Common;
using Npgsql;

namespace GelDispense.Service.Storage;

/// <summary>PostgreSQL for sites with several service replicas; one pooled data source per process.</summary>
public sealed class PostgresDatabase(string connectionString, TimeProvider time) : Database(time), IAsyncDisposable
{
    private readonly NpgsqlDataSource _dataSource = NpgsqlDataSource.Create(WithPoolDefaults(connectionString));

    public const string EngineName = "Postgres";

    public override string Engine => EngineName;

    // Any fixed key will do; it only has to be the same for every replica of this service.
    public override string MigrationLockSql => "SELECT pg_advisory_xact_lock(7346201)";

    public override async Task<DbConnection> OpenRawAsync(CancellationToken cancellationToken) =>
        await _dataSource.OpenConnectionAsync(cancellationToken);

    // Dapper passes a list to Npgsql as one array parameter.
    public override string AnyOf(string column, string parameter) => $"{column} = ANY(@{parameter})";

    // 23505 unique_violation, 40001 serialization_failure, 40P01 deadlock_detected: all mean "read again and retry".
    public override bool IsConflict(DbException exception) =>
        exception is PostgresException { SqlState: "23505" or "40001" or "40P01" };

    public ValueTask DisposeAsync() => _dataSource.DisposeAsync();

    /// <summary>
    /// Unless the connection string says otherwise: pooled connections keep their session (the service sets no session
    /// state, and its migration lock is transaction-scoped), so PostgreSQL is not sent DISCARD ALL on every return to
    /// the pool and keeps the statements Npgsql prepares automatically once they repeat. Measured with 50 stations:
    /// PostgreSQL stopped planning every statement on every call (docs/performance.md).
    /// </summary>
    public static string WithPoolDefaults(string connectionString)
    {
        var builder = new NpgsqlConnectionStringBuilder(connectionString);
        var given = new DbConnectionStringBuilder { ConnectionString = connectionString };
        if (!given.ContainsKey("No Reset On Close") && !given.ContainsKey("NoResetOnClose"))
        {
            builder.NoResetOnClose = true;
        }

        if (!given.ContainsKey("Max Auto Prepare") && !given.ContainsKey("MaxAutoPrepare"))
        {
            builder.MaxAutoPrepare = 32;
        }

        return builder.ConnectionString;
    }
}
