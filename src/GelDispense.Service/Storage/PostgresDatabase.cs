using System.Data.Common;
using Npgsql;

namespace GelDispense.Service.Storage;

/// <summary>PostgreSQL for sites with several service replicas; one pooled data source per process.</summary>
public sealed class PostgresDatabase(string connectionString, TimeProvider time) : Database(time), IAsyncDisposable
{
    private readonly NpgsqlDataSource _dataSource = NpgsqlDataSource.Create(connectionString);

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
}
