using System.Globalization;
using Microsoft.Data.Sqlite;

namespace GelDispense.Agent.Journal;

/// <summary>
/// The station's durable record of confirmed additions, written before anything is sent to the service. The file
/// runs in WAL mode with <c>synchronous=FULL</c>, so a commit is on disk (the WAL fsynced) when a call returns: an
/// addition confirmed here survives a crash or a power cut and is replayed later. One agent owns the file; calls are
/// serialised on one connection.
/// </summary>
public sealed class AdditionJournal : IDisposable
{
    private readonly SqliteConnection _connection;
    private readonly TimeProvider _time;
    private readonly Lock _gate = new();

    private AdditionJournal(SqliteConnection connection, TimeProvider time)
    {
        _connection = connection;
        _time = time;
    }

    public string Path { get; private init; } = "";

    public static AdditionJournal Open(string path, TimeProvider time)
    {
        var directory = System.IO.Path.GetDirectoryName(System.IO.Path.GetFullPath(path));
        if (directory is not null)
        {
            Directory.CreateDirectory(directory);
        }

        // No pooling: the file must be released when the journal is disposed (a reopen in the same process is a restart).
        var connection = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = path, Pooling = false }.ToString());
        connection.Open();
        var journal = new AdditionJournal(connection, time) { Path = path };
        journal.Execute("PRAGMA journal_mode=WAL;");
        journal.Execute("PRAGMA synchronous=FULL;");
        journal.Execute(JournalSchema.Create);
        journal.Execute($"PRAGMA user_version={JournalSchema.Version};");
        return journal;
    }

    /// <summary>Stores a confirmed addition as pending and returns it with its place in the journal order.</summary>
    public JournalEntry AppendPending(NewAddition addition)
    {
        var confirmedAt = _time.GetUtcNow();
        lock (_gate)
        {
            using var command = _connection.CreateCommand();
            command.CommandText = $"""
                INSERT INTO additions (addition_id, batch_id, step_index, reading_g, source, lot_id, confirmed_at, state)
                VALUES ($id, $batch, $step, $reading, $source, $lot, $at, '{JournalState.Pending}')
                RETURNING seq;
                """;
            command.Parameters.AddWithValue("$id", addition.AdditionId.ToString());
            command.Parameters.AddWithValue("$batch", addition.BatchId);
            command.Parameters.AddWithValue("$step", addition.StepIndex);
            command.Parameters.AddWithValue("$reading", addition.ReadingG);
            command.Parameters.AddWithValue("$source", addition.Source);
            command.Parameters.AddWithValue("$lot", addition.LotId);
            command.Parameters.AddWithValue("$at", Text(confirmedAt));
            var sequence = (long)command.ExecuteScalar()!;
            return new JournalEntry(sequence, addition.AdditionId.ToString(), addition.BatchId, addition.StepIndex, addition.ReadingG,
                addition.Source, addition.LotId, confirmedAt, JournalState.Pending, null, "");
        }
    }

    /// <summary>Marks an entry acknowledged by the service; <paramref name="detail"/> says how (recorded, replayed).</summary>
    public void MarkSent(string additionId, string detail) => Settle(additionId, JournalState.Sent, detail);

    /// <summary>Marks an entry refused for good, with the service's reason; it stays in the file.</summary>
    public void MarkRejected(string additionId, string reason) => Settle(additionId, JournalState.Rejected, reason);

    /// <summary>Every pending entry of every batch, in journal order: the replay queue.</summary>
    public IReadOnlyList<JournalEntry> Pending() =>
        Query($"SELECT {JournalSchema.Columns} FROM additions WHERE state = '{JournalState.Pending}' ORDER BY seq", null);

    /// <summary>Every entry of one batch, in journal order.</summary>
    public IReadOnlyList<JournalEntry> ForBatch(string batchId) =>
        Query($"SELECT {JournalSchema.Columns} FROM additions WHERE batch_id = $batch ORDER BY seq", batchId);

    /// <summary>Keeps the latest copy of a batch (protobuf JSON) for resuming without the service.</summary>
    public void SaveBatch(string batchId, string batchJson)
    {
        lock (_gate)
        {
            using var command = _connection.CreateCommand();
            command.CommandText = """
                INSERT INTO batches (batch_id, batch_json, saved_at) VALUES ($batch, $json, $at)
                ON CONFLICT (batch_id) DO UPDATE SET batch_json = excluded.batch_json, saved_at = excluded.saved_at;
                """;
            command.Parameters.AddWithValue("$batch", batchId);
            command.Parameters.AddWithValue("$json", batchJson);
            command.Parameters.AddWithValue("$at", Text(_time.GetUtcNow()));
            command.ExecuteNonQuery();
        }
    }

    public string? LoadBatch(string batchId)
    {
        lock (_gate)
        {
            using var command = _connection.CreateCommand();
            command.CommandText = "SELECT batch_json FROM batches WHERE batch_id = $batch";
            command.Parameters.AddWithValue("$batch", batchId);
            return command.ExecuteScalar() as string;
        }
    }

    public void Dispose() => _connection.Dispose();

    private void Settle(string additionId, JournalState state, string detail)
    {
        lock (_gate)
        {
            using var command = _connection.CreateCommand();
            command.CommandText = "UPDATE additions SET state = $state, settled_at = $at, detail = $detail WHERE addition_id = $id";
            command.Parameters.AddWithValue("$state", state.ToString());
            command.Parameters.AddWithValue("$at", Text(_time.GetUtcNow()));
            command.Parameters.AddWithValue("$detail", detail);
            command.Parameters.AddWithValue("$id", additionId);
            if (command.ExecuteNonQuery() != 1)
            {
                throw new InvalidOperationException($"The journal has no addition '{additionId}' to mark {state}.");
            }
        }
    }

    private List<JournalEntry> Query(string sql, string? batchId)
    {
        lock (_gate)
        {
            using var command = _connection.CreateCommand();
            command.CommandText = sql;
            if (batchId is not null)
            {
                command.Parameters.AddWithValue("$batch", batchId);
            }

            using var reader = command.ExecuteReader();
            var entries = new List<JournalEntry>();
            while (reader.Read())
            {
                entries.Add(new JournalEntry(
                    reader.GetInt64(0), reader.GetString(1), reader.GetString(2), reader.GetInt32(3), reader.GetDouble(4),
                    reader.GetString(5), reader.GetString(6), Parse(reader.GetString(7)), Enum.Parse<JournalState>(reader.GetString(8)),
                    reader.IsDBNull(9) ? null : Parse(reader.GetString(9)), reader.GetString(10)));
            }

            return entries;
        }
    }

    private void Execute(string sql)
    {
        using var command = _connection.CreateCommand();
        command.CommandText = sql;
        command.ExecuteNonQuery();
    }

    private static string Text(DateTimeOffset at) => at.ToUniversalTime().ToString("O", CultureInfo.InvariantCulture);

    private static DateTimeOffset Parse(string text) => DateTimeOffset.Parse(text, CultureInfo.InvariantCulture, DateTimeStyles.RoundtripKind);
}
