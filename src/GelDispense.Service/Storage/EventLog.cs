using System.Data.Common;
using Dapper;

namespace GelDispense.Service.Storage;

/// <summary>
/// The service-wide batch event log. Sequence numbers come from bumping a single counter row inside the
/// writing transaction: its row lock is held until commit, so numbers are handed out in commit order and a
/// reader paging by sequence never skips an event that commits late (a plain sequence or autoincrement
/// would allow that on PostgreSQL).
/// </summary>
public static class EventLog
{
    public static Task<long> NextSequenceAsync(DbConnection connection, DbTransaction transaction) =>
        connection.ExecuteScalarAsync<long>(
            "UPDATE event_sequence SET last_seq = last_seq + 1 WHERE id = 1 RETURNING last_seq", transaction: transaction);

    public static Task AppendAsync(
        DbConnection connection, DbTransaction transaction, long seq, string batchId, string type, string body, DateTimeOffset at) =>
        connection.ExecuteAsync(
            "INSERT INTO batch_events (seq, batch_id, type, body, occurred_at) VALUES (@seq, @batchId, @type, @body, @at)",
            new { seq, batchId, type, body, at = TimeText.Format(at) }, transaction);
}
