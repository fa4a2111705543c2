using System.Data.Common;
using Dapper;

namespace GelDispense.Service.Storage;

/// <summary>
/// The service-wide batch event log. Sequence numbers come from bumping a single counter row inside the
/// writing transaction: its row lock is held until commit, so numbers are handed out in commit order and a
/// reader paging by sequence never skips an event that commits late (a plain sequence or autoincrement
/// would allow that on PostgreSQL). Every write of every batch passes through that one row, so a write does all
/// it can before bumping it; on PostgreSQL the bump, the event, the batch's pointer and the commit then go in one
/// statement, and the row is held for no round trip to the service at all. The counter row also keeps the running
/// maximum of the batches' updated_at in sequence order, and each write stamps it on its batch as high_water_at
/// (migration 0007), where the LIMS list's "changed after" filter finds where in the event order to start.
/// </summary>
public static class EventLog
{
    /// <summary>
    /// Appends the event <paramref name="entryAt"/> makes for its sequence number (its hashes are ignored), chained to
    /// <paramref name="prevHash"/>, the hash of the batch's latest event ("" for a new batch), points the batch at it
    /// and commits the transaction; returns the sequence number. The caller reads the latest hash after claiming (or
    /// creating) the batch row, which serialises the writers of one batch, so it cannot change under this one.
    /// </summary>
    public static async Task<long> AppendAndCommitAsync(
        IDatabase database, DbConnection connection, DbTransaction transaction, string prevHash, Func<long, EventRow> entryAt, AdditionRow? addition,
        CorrectionRow? correction, CancellationToken cancellationToken)
    {
        var draft = entryAt(0);
        if (database.Engine == PostgresDatabase.EngineName)
        {
            var parameters = PostgresParameters(draft, addition, correction);
            parameters.Add("prevHash", prevHash);
            // COMMIT in the same round trip: Npgsql sees the transaction end, and the caller's dispose has nothing left to
            // roll back; after an error the COMMIT is skipped and the dispose rolls back.
            return await connection.ExecuteScalarAsync<long>(new CommandDefinition(
                $"{PostgresAppend("prev AS (SELECT @prevHash AS hash)", "TRUE", "")};\nCOMMIT", parameters, transaction, cancellationToken: cancellationToken));
        }

        var entry = entryAt(await connection.ExecuteScalarAsync<long>(new CommandDefinition("""
            UPDATE event_sequence SET last_seq = last_seq + 1,
                high_water_at = MAX(high_water_at, (SELECT updated_at FROM batches WHERE id = @BatchId))
            WHERE id = 1 RETURNING last_seq
            """, new { draft.BatchId }, transaction, cancellationToken: cancellationToken)));
        var hash = AuditChain.Link(prevHash, AuditChain.Canonical(entry, addition, correction));
        await connection.ExecuteAsync(new CommandDefinition("""
            UPDATE batches SET last_event_seq = @Seq, high_water_at = (SELECT high_water_at FROM event_sequence WHERE id = 1) WHERE id = @BatchId;
            INSERT INTO batch_events (seq, batch_id, type, body, occurred_at, actor_key_id, station_id, addition_id, correction_id, prev_hash, hash)
            VALUES (@Seq, @BatchId, @Type, @Body, @OccurredAt, @ActorKeyId, @StationId, @AdditionId, @CorrectionId, @prevHash, @hash)
            """, new { entry.Seq, entry.BatchId, entry.Type, entry.Body, entry.OccurredAt, entry.ActorKeyId, entry.StationId, entry.AdditionId, entry.CorrectionId, prevHash, hash },
            transaction, cancellationToken: cancellationToken));
        await transaction.CommitAsync(cancellationToken);
        return entry.Seq;
    }

    /// <summary>
    /// PostgreSQL: one statement that, after the caller's CTEs <paramref name="before"/> (which must define
    /// <c>prev(hash)</c>, the batch's latest hash, with no row when nothing may be written), bumps the counter when
    /// <paramref name="mayWrite"/> holds, inserts the event with its hash computed in SQL, sets
    /// <paramref name="batchSets"/> and the event pointer on the batch and returns the sequence number (no row when
    /// nothing was written). The hash is AuditChain.Link(prev, AuditChain.Canonical(entry)): the seq field (name, length, value, newline)
    /// is written here because only this statement knows the number. The batch's updated_at, which the counter's
    /// running maximum takes in, is the event's time in every write.
    /// </summary>
    public static string PostgresAppend(string before, string mayWrite, string batchSets) => $"""
        WITH {before},
        next AS (
            UPDATE event_sequence SET last_seq = last_seq + 1, high_water_at = GREATEST(high_water_at, @eventAt)
            WHERE id = 1 AND {mayWrite} RETURNING last_seq AS seq, high_water_at),
        event AS (
            INSERT INTO batch_events (seq, batch_id, type, body, occurred_at, actor_key_id, station_id, addition_id, correction_id, prev_hash, hash)
            SELECT next.seq, @eventBatchId, @eventType, @eventBody, @eventAt, @eventActorKeyId, @eventStationId, @eventAdditionId, @eventCorrectionId, prev.hash,
                   encode(sha256(convert_to(prev.hash || 'seq:' || length(next.seq::text) || ':' || next.seq::text || chr(10) || @afterSeq, 'UTF8')), 'hex')
            FROM next, prev
            RETURNING seq)
        UPDATE batches SET {batchSets}last_event_seq = event.seq, high_water_at = next.high_water_at FROM event, next WHERE batches.id = @eventBatchId
        RETURNING event.seq
        """;

    /// <summary>The parameters <see cref="PostgresAppend"/> reads, from the event drafted without its number.</summary>
    public static DynamicParameters PostgresParameters(EventRow draft, AdditionRow? addition, CorrectionRow? correction)
    {
        var parameters = new DynamicParameters();
        parameters.AddDynamicParams(new
        {
            eventBatchId = draft.BatchId, eventType = draft.Type, eventBody = draft.Body, eventAt = draft.OccurredAt, eventActorKeyId = draft.ActorKeyId,
            eventStationId = draft.StationId, eventAdditionId = draft.AdditionId, eventCorrectionId = draft.CorrectionId,
            afterSeq = AuditChain.AfterSeq(draft, addition, correction),
        });
        return parameters;
    }
}
