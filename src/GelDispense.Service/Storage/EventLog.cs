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

    /// <summary>
    /// Appends <paramref name="entry"/> (its hashes are ignored) chained to the batch's latest event. Writers of one
    /// batch are serialised by the batch row they claim first, so the latest event cannot change under this one.
    /// </summary>
    public static async Task AppendAsync(DbConnection connection, DbTransaction transaction, EventRow entry, AdditionRow? addition, CorrectionRow? correction = null)
    {
        var prevHash = await connection.ExecuteScalarAsync<string?>(
            "SELECT hash FROM batch_events WHERE batch_id = @BatchId ORDER BY seq DESC LIMIT 1", new { entry.BatchId }, transaction) ?? "";
        var hash = AuditChain.Link(prevHash, AuditChain.Canonical(entry, addition, correction));
        await connection.ExecuteAsync("""
            INSERT INTO batch_events (seq, batch_id, type, body, occurred_at, actor_key_id, station_id, addition_id, correction_id, prev_hash, hash)
            VALUES (@Seq, @BatchId, @Type, @Body, @OccurredAt, @ActorKeyId, @StationId, @AdditionId, @CorrectionId, @prevHash, @hash)
            """, new { entry.Seq, entry.BatchId, entry.Type, entry.Body, entry.OccurredAt, entry.ActorKeyId, entry.StationId, entry.AdditionId, entry.CorrectionId, prevHash, hash },
            transaction);
    }
}
