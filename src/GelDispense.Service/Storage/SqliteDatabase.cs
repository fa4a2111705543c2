using System.Data.Common;
using Microsoft.Data.Sqlite;

namespace GelDispense.Service.Storage;

/// <summary>
/// The embedded default. WAL lets readers run beside the single writer; the busy timeout (Microsoft.Data.Sqlite's
/// 30 s unless the connection string sets <c>Default Timeout</c>) makes writers queue instead of failing, and
/// Microsoft.Data.Sqlite begins transactions IMMEDIATE, so a writer holds the lock from its first statement.
/// </summary>
public sealed class SqliteDatabase : Database
{
    private readonly string _connectionString;
    private readonly SemaphoreSlim _writer = new(1, 1);
    private int _walSet;

    public SqliteDatabase(string connectionString, TimeProvider time)
        : base(time)
    {
        var builder = new SqliteConnectionStringBuilder(connectionString) { ForeignKeys = true };
        if (builder.Mode != SqliteOpenMode.Memory && !string.IsNullOrEmpty(builder.DataSource) && builder.DataSource != ":memory:")
        {
            var directory = Path.GetDirectoryName(Path.GetFullPath(builder.DataSource));
            if (!string.IsNullOrEmpty(directory))
            {
                Directory.CreateDirectory(directory);
            }
        }

        _connectionString = builder.ToString();
    }

    public override string Engine => "Sqlite";

    public override string MigrationLockSql => "SELECT 1";

    public override async Task<DbConnection> OpenRawAsync(CancellationToken cancellationToken)
    {
        var connection = new SqliteConnection(_connectionString);
        await connection.OpenAsync(cancellationToken);
        await using var pragma = connection.CreateCommand();
        // WAL is stored in the database file, so the first connection of the process sets it for all; switching the
        // journal mode takes a lock and reads the file header, which every open used to pay. synchronous is per
        // connection and only flips a flag (NORMAL: in WAL mode a commit no longer waits for fsync).
        var walSet = Volatile.Read(ref _walSet) == 1;
        pragma.CommandText = walSet ? "PRAGMA synchronous = NORMAL;" : "PRAGMA journal_mode = WAL; PRAGMA synchronous = NORMAL;";
        await pragma.ExecuteNonQueryAsync(cancellationToken);
        if (!walSet)
        {
            Volatile.Write(ref _walSet, 1);
        }

        return connection;
    }

    /// <summary>
    /// SQLite takes one writer at a time. Two writers of this process that collide get SQLITE_BUSY, and
    /// Microsoft.Data.Sqlite retries that by putting the thread to sleep for 150 ms per attempt, so a few concurrent
    /// additions cost hundreds of milliseconds each. Queueing them here first makes them wait only for each other's
    /// few statements. Other processes on the same file still meet the busy retry.
    /// </summary>
    public override async ValueTask<IDisposable> EnterWriteAsync(CancellationToken cancellationToken)
    {
        await _writer.WaitAsync(cancellationToken);
        return new Turn(_writer);
    }

    // Dapper expands a list parameter into (@p1, @p2, …).
    public override string AnyOf(string column, string parameter) => $"{column} IN @{parameter}";

    // SQLITE_CONSTRAINT (19): a unique key taken by a concurrent writer between our read and our write.
    public override bool IsConflict(DbException exception) => exception is SqliteException { SqliteErrorCode: 19 };

    // SQLITE_BUSY (5) and SQLITE_LOCKED (6): another process held the file past the command timeout. Microsoft.Data.Sqlite
    // retries them until then but does not mark them transient.
    public override bool IsTransient(DbException exception) => exception is SqliteException { SqliteErrorCode: 5 or 6 } || base.IsTransient(exception);

    private sealed class Turn(SemaphoreSlim writer) : IDisposable
    {
        private int _released;

        public void Dispose()
        {
            if (Interlocked.Exchange(ref _released, 1) == 0)
            {
                writer.Release();
            }
        }
    }
}
