using System.Data.Common;

namespace GelDispense.Service.Storage;

/// <summary>What both engines share: open-then-migrate-once, with the migration run by <see cref="MigrationRunner"/>.</summary>
public abstract class Database : IDatabase
{
    private readonly Lazy<Task> _migration;

    protected Database(TimeProvider time) =>
        _migration = new Lazy<Task>(() => MigrationRunner.ApplyAsync(this, time, CancellationToken.None));

    public abstract string Engine { get; }

    /// <summary>SQL run first inside the migration transaction, so two replicas starting at once migrate one after the other.</summary>
    public abstract string MigrationLockSql { get; }

    public Task MigrateAsync(CancellationToken cancellationToken) => _migration.Value.WaitAsync(cancellationToken);

    public async Task<DbConnection> OpenAsync(CancellationToken cancellationToken)
    {
        await MigrateAsync(cancellationToken);
        return await OpenRawAsync(cancellationToken);
    }

    public abstract bool IsConflict(DbException exception);

    public virtual bool IsTransient(DbException exception) => exception.IsTransient;

    public virtual ValueTask<IDisposable> EnterWriteAsync(CancellationToken cancellationToken) => ValueTask.FromResult(NoTurn.Instance);

    public abstract string AnyOf(string column, string parameter);

    /// <summary>An open connection without waiting for migrations (the migration runner's own).</summary>
    public abstract Task<DbConnection> OpenRawAsync(CancellationToken cancellationToken);

    private sealed class NoTurn : IDisposable
    {
        public static readonly IDisposable Instance = new NoTurn();

        public void Dispose()
        {
            // Nothing was held.
        }
    }
}
