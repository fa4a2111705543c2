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

    /// <summary>
    /// Waits for this process's turn to write, held until disposed. Engines that allow one writer at a time queue
    /// their writers here, asynchronously and in arrival order; the others return at once.
    /// </summary>
    ValueTask<IDisposable> EnterWriteAsync(CancellationToken cancellationToken);

    /// <summary>SQL for "<paramref name="column"/> is one of the list parameter <paramref name="parameter"/>" (a Dapper list).</summary>
    string AnyOf(string column, string parameter);

    /// <summary>True when a write conflicted with a concurrent one and should be retried from a fresh read.</summary>
    bool IsConflict(DbException exception);

    /// <summary>True when the database failed for a moment (a dropped connection, a restart, a lock held too long) and the call may be retried.</summary>
    bool IsTransient(DbException exception);
}
