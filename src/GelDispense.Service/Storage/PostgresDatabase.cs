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

    /// <summary>Connections the pool keeps at most unless the connection string says otherwise (see <see cref="WithPoolDefaults"/>).</summary>
    public const int DefaultMaxPoolSize = 4;

    /// <summary>
    /// Unless the connection string says otherwise:
    /// <list type="bullet">
    /// <item>Pooled connections keep their session (the service sets no session state, and its migration lock is
    /// transaction-scoped), so PostgreSQL is not sent DISCARD ALL on every return to the pool and keeps the
    /// statements Npgsql prepares automatically once they repeat. Measured with 50 stations: PostgreSQL stopped
    /// planning every statement on every call (docs/performance.md).</item>
    /// <item>At most <see cref="DefaultMaxPoolSize"/> connections, not Npgsql's 100. Measured with 50 stations on two
    /// cores, a pool of 4 to 8 took the same additions for about 0.4 ms of PostgreSQL CPU each against 0.6 ms when every
    /// station had a backend of its own, and the service's write alone ran about twice as fast; letting only 4 writes
    /// into PostgreSQL at once over the large pool did not help, so it is the number of backends taking turns that
    /// costs (docs/performance.md). Common practice
    /// (the PostgreSQL wiki's "Number Of Database Connections", recalled) sizes all pools on a server together to
    /// about twice its cores; with several replicas, give each its share.</item>
    /// </list>
    /// </summary>
    public static string WithPoolDefaults(string connectionString)
    {
        var builder = new NpgsqlConnectionStringBuilder(connectionString);
        var given = new DbConnectionStringBuilder { ConnectionString = connectionString };
        if (!Gives(given, "NoResetOnClose"))
        {
            builder.NoResetOnClose = true;
        }

        if (!Gives(given, "MaxAutoPrepare"))
        {
            builder.MaxAutoPrepare = 32;
        }

        if (!Gives(given, "MaximumPoolSize", "MaxPoolSize"))
        {
            builder.MaxPoolSize = DefaultMaxPoolSize;
        }

        return builder.ConnectionString;
    }

    /// <summary>Whether the connection string sets the keyword in any of its spellings (case and spaces aside).</summary>
    private static bool Gives(DbConnectionStringBuilder given, params string[] keywords) =>
        given.Keys.Cast<string>().Any(key => keywords.Contains(key.Replace(" ", "", StringComparison.Ordinal), StringComparer.OrdinalIgnoreCase));
}
