using System.Data.Common;

namespace GelDispense.Service.Storage;

/// <summary>The one database the service keeps its state in; opening a connection waits for the schema migrations.</summary>
public interface IDatabase
{
    /// <summary>"Sqlite" or "Postgres": picks the migration scripts.</summary>
    string Engine { get; }

    /// <summary>Applies pending migrations once per process; later calls return the same task.</summary>
    Task MigrateAsync(CancellationToken cancellationToken);

    /// <summary>An open connection on a migrated schema.</summary>
    Task<DbConnection> OpenAsync(CancellationToken cancellationToken);

    /// <summary>True when a write conflicted with a concurrent one and should be retried from a fresh read.</summary>
    bool IsConflict(DbException exception);
}
