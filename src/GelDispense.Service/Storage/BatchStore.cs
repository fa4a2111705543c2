using System.Data.Common;
using Dapper;

namespace GelDispense.Service.Storage;

/// <summary>
/// Batches, recipe revisions, additions and the event log. Every change to a batch is a version-checked
/// update (optimistic concurrency): a writer that read an older version gets <see cref="WriteOutcome.Conflict"/>
/// and must read again. Additions, their corrections and events are only ever inserted.
/// </summary>
public sealed class BatchStore(IDatabase database)
{
    private const string SelectBatch = """
        SELECT b.id, b.station_id, b.status, b.recipe_revision_id, r.name AS recipe_name, r.revision AS recipe_revision,
               r.body AS recipe_body, b.setup, COALESCE(p.plan, b.plan) AS plan, b.plan_revision,
               b.abort_reason, b.created_at, b.updated_at, b.version, b.last_event_seq
        FROM batches b JOIN recipe_revisions r ON r.id = b.recipe_revision_id
        LEFT JOIN plan_revisions p ON p.batch_id = b.id AND p.revision = b.plan_revision
        """;

    // Without the stored response: only a replay needs it (ResponseAsync), and it is the largest column by far.
    private const string SelectAddition = """
        SELECT batch_id, addition_id, ordinal, step_index, reading_g, stable, source, lot_id, true_mass_g,
               within_window, recorded_at, content_hash, plan_revision, target_mass_g, acceptance_g
        FROM additions
        """;

    private const string CorrectionColumns = """
        c.batch_id, c.correction_id, c.addition_id, c.corrects_seq, c.previous_reading_g, c.reading_g, c.true_mass_g,
        c.within_window, c.reason, c.actor_key_id, c.station_id, c.recorded_at, c.content_hash
        """;

    // The event's sequence comes along: it orders the corrections and is what a later correction supersedes.
    private const string SelectCorrection = $"""
        SELECT {CorrectionColumns}, e.seq
        FROM addition_corrections c JOIN batch_events e ON e.batch_id = c.batch_id AND e.correction_id = c.correction_id
        """;

    static BatchStore() => DefaultTypeMap.MatchNamesWithUnderscores = true;

    /// <summary>
    /// Stores a batch and returns it as stored (what <see cref="FindAsync"/> would read back); null when a concurrent
    /// writer took the same recipe revision number (retry).
    /// </summary>
    public async Task<BatchRow?> TryCreateAsync(NewBatch batch, CancellationToken cancellationToken)
    {
        using var turn = await database.EnterWriteAsync(cancellationToken);
        await using var connection = await database.OpenAsync(cancellationToken);
        await using var transaction = await connection.BeginTransactionAsync(cancellationToken);
        try
        {
            var (revisionId, revision) = await RecipeRevisionAsync(connection, transaction, batch, cancellationToken);
            // The batch points at its first event once that has its number (EventLog).
            await connection.ExecuteAsync(new CommandDefinition("""
                INSERT INTO batches (id, station_id, status, recipe_revision_id, setup, plan, abort_reason, created_at, updated_at, version, last_event_seq)
                VALUES (@Id, @StationId, @Status, @revisionId, @Setup, @Plan, '', @at, @at, 1, 0)
                """, new { batch.Id, batch.StationId, batch.Status, revisionId, batch.Setup, batch.Plan, at = TimeText.Format(batch.At) }, transaction, cancellationToken: cancellationToken));
            var eventSeq = await EventLog.AppendAndCommitAsync(database, connection, transaction, "", seq => new EventRow
            {
                Seq = seq, BatchId = batch.Id, Type = batch.EventType, Body = batch.EventBody, OccurredAt = TimeText.Format(batch.At),
                ActorKeyId = batch.ActorKeyId, StationId = batch.StationId,
            }, null, null, cancellationToken);
            // A recipe revision with the same content hash holds the same body.
            return new BatchRow
            {
                Id = batch.Id, StationId = batch.StationId, Status = batch.Status, RecipeRevisionId = revisionId, RecipeName = batch.RecipeName,
                RecipeRevision = revision, RecipeBody = batch.RecipeBody, Setup = batch.Setup, Plan = batch.Plan, PlanRevision = 0, AbortReason = "",
                CreatedAt = TimeText.Format(batch.At), UpdatedAt = TimeText.Format(batch.At), Version = 1, LastEventSeq = eventSeq,
            };
        }
        catch (DbException e) when (database.IsConflict(e))
        {
            return null;
        }
    }

    public async Task<BatchRow?> FindAsync(string id, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        return await connection.QuerySingleOrDefaultAsync<BatchRow>(new CommandDefinition($"{SelectBatch} WHERE b.id = @id", new { id }, cancellationToken: cancellationToken));
    }

    /// <summary>
    /// What an addition reads before anything else, in one round trip: the batch's status, version and plan revision,
    /// its additions so far and their corrections. The reads need not agree: a write made from them checks the version.
    /// </summary>
    public async Task<BatchProgress?> ProgressAsync(string id, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        await using var reads = await connection.QueryMultipleAsync(new CommandDefinition($"""
            SELECT id, status, station_id, version, plan_revision FROM batches WHERE id = @id;
            {SelectAddition} WHERE batch_id = @id ORDER BY ordinal;
            {SelectCorrection} WHERE c.batch_id = @id ORDER BY e.seq
            """, new { id }, cancellationToken: cancellationToken));
        var head = await reads.ReadSingleOrDefaultAsync<BatchHead>();
        var additions = await reads.ReadAsync<AdditionRow>();
        var corrections = await reads.ReadAsync<CorrectionRow>();
        return head is null ? null : new BatchProgress(head, [.. additions], [.. corrections]);
    }

    /// <summary>What never changes about a batch: its recipe revision, its setup and its first plan (revision 0).</summary>
    public async Task<BatchOrigin?> OriginAsync(string id, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        return await connection.QuerySingleOrDefaultAsync<BatchOrigin>(new CommandDefinition("""
            SELECT b.id, r.body AS recipe_body, b.setup, b.plan AS first_plan
            FROM batches b JOIN recipe_revisions r ON r.id = b.recipe_revision_id WHERE b.id = @id
            """, new { id }, cancellationToken: cancellationToken));
    }

    /// <summary>A stored re-plan of a batch (revisions from 1; revision 0 is the batch's first plan).</summary>
    public async Task<PlanRevisionRow?> PlanRevisionAsync(string batchId, long revision, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        return await connection.QuerySingleOrDefaultAsync<PlanRevisionRow>(new CommandDefinition(
            "SELECT batch_id, revision, plan, scale_factor, cause_addition_id, created_at FROM plan_revisions WHERE batch_id = @batchId AND revision = @revision",
            new { batchId, revision }, cancellationToken: cancellationToken));
    }

    /// <summary>The response stored with an addition, which a replay of it returns unchanged: its text and bytes columns.</summary>
    public async Task<(string Text, byte[]? Bytes)> ResponseAsync(string batchId, string additionId, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        return await connection.QuerySingleAsync<(string, byte[]?)>(new CommandDefinition(
            "SELECT response, response_bytes FROM additions WHERE batch_id = @batchId AND addition_id = @additionId", new { batchId, additionId }, cancellationToken: cancellationToken));
    }

    /// <summary>The response stored with a correction, which a replay of it returns.</summary>
    public async Task<string> CorrectionResponseAsync(string batchId, string correctionId, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        return await connection.QuerySingleAsync<string>(new CommandDefinition(
            "SELECT response FROM addition_corrections WHERE batch_id = @batchId AND correction_id = @correctionId", new { batchId, correctionId }, cancellationToken: cancellationToken));
    }

    /// <summary>The sequence of the event that recorded an addition; 0 for additions recorded before events named them.</summary>
    public async Task<long> AdditionEventSeqAsync(string batchId, string additionId, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        return await connection.ExecuteScalarAsync<long?>(new CommandDefinition(
            "SELECT seq FROM batch_events WHERE batch_id = @batchId AND addition_id = @additionId", new { batchId, additionId }, cancellationToken: cancellationToken)) ?? 0;
    }

    /// <summary>Corrections of the given batches' additions, oldest first within each batch.</summary>
    public async Task<IReadOnlyList<CorrectionRow>> CorrectionsAsync(IReadOnlyCollection<string> batchIds, CancellationToken cancellationToken)
    {
        if (batchIds.Count == 0)
        {
            return [];
        }

        await using var connection = await database.OpenAsync(cancellationToken);
        var rows = await connection.QueryAsync<CorrectionRow>(new CommandDefinition(
            $"{SelectCorrection} WHERE {database.AnyOf("c.batch_id", "batchIds")} ORDER BY e.seq", new { batchIds = batchIds.ToArray() }, cancellationToken: cancellationToken));
        return [.. rows];
    }

    public async Task<IReadOnlyList<AdditionRow>> AdditionsAsync(IReadOnlyCollection<string> batchIds, CancellationToken cancellationToken)
    {
        if (batchIds.Count == 0)
        {
            return [];
        }

        await using var connection = await database.OpenAsync(cancellationToken);
        var rows = await connection.QueryAsync<AdditionRow>(new CommandDefinition(
            $"{SelectAddition} WHERE {database.AnyOf("batch_id", "batchIds")} ORDER BY batch_id, ordinal", new { batchIds = batchIds.ToArray() }, cancellationToken: cancellationToken));
        return [.. rows];
    }

    /// <summary>
    /// Appends an addition if the batch is still at <paramref name="expectedVersion"/>. A <paramref name="replan"/>
    /// is appended as the batch's next plan revision and put in force; earlier revisions are never touched.
    /// </summary>
    public Task<WriteOutcome> TryAppendAdditionAsync(
        AdditionRow addition, long expectedVersion, PlanRevisionRow? replan, string eventBody, DateTimeOffset at, EventAudit audit,
        CancellationToken cancellationToken) =>
        WriteVersionedAsync(new VersionedWrite(addition.BatchId, expectedVersion, at, "ADDITION_RECORDED", eventBody, audit)
        {
            Insert = """
                INSERT INTO additions (batch_id, addition_id, ordinal, step_index, reading_g, stable, source, lot_id, true_mass_g,
                                       within_window, recorded_at, content_hash, response, response_bytes, plan_revision, target_mass_g, acceptance_g)
                SELECT @BatchId, @AdditionId, @Ordinal, @StepIndex, @ReadingG, @Stable, @Source, @LotId, @TrueMassG,
                       @WithinWindow, @RecordedAt, @ContentHash, @Response, @ResponseBytes, @PlanRevision, @TargetMassG, @AcceptanceG
                """,
            Row = addition, Addition = addition, Replan = replan,
        }, cancellationToken);

    /// <summary>
    /// Appends a correction (and its event) if the batch is still at <paramref name="expectedVersion"/>; the addition
    /// and earlier corrections stay as they are. A <paramref name="replan"/> becomes the next plan revision.
    /// </summary>
    public Task<WriteOutcome> TryAppendCorrectionAsync(
        CorrectionRow correction, long expectedVersion, PlanRevisionRow? replan, string eventBody, DateTimeOffset at, CancellationToken cancellationToken) =>
        WriteVersionedAsync(new VersionedWrite(
            correction.BatchId, expectedVersion, at, "ADDITION_CORRECTED", eventBody, new EventAudit(correction.ActorKeyId, correction.StationId))
        {
            Insert = """
                INSERT INTO addition_corrections (batch_id, correction_id, addition_id, corrects_seq, previous_reading_g, reading_g, true_mass_g,
                                                  within_window, reason, actor_key_id, station_id, recorded_at, content_hash, response)
                SELECT @BatchId, @CorrectionId, @AdditionId, @CorrectsSeq, @PreviousReadingG, @ReadingG, @TrueMassG,
                       @WithinWindow, @Reason, @ActorKeyId, @StationId, @RecordedAt, @ContentHash, @Response
                """,
            Row = correction, Correction = correction, Replan = replan,
        }, cancellationToken);

    /// <summary>Moves the batch to another status if it is still at <paramref name="expectedVersion"/>.</summary>
    public Task<WriteOutcome> TrySetStatusAsync(
        string batchId, long expectedVersion, string status, string abortReason, string eventType, string eventBody, DateTimeOffset at,
        EventAudit audit, CancellationToken cancellationToken) =>
        WriteVersionedAsync(new VersionedWrite(batchId, expectedVersion, at, eventType, eventBody, audit) { Status = (status, abortReason) }, cancellationToken);

    /// <summary>
    /// Batches whose latest event is after <paramref name="afterSeq"/>, in event order (the LIMS keyset). With
    /// <paramref name="updatedAfter"/>, the walk starts at the first batch whose high water (migration 0007) is after
    /// it: every batch before that one in event order changed at or before that time, so none of them is read.
    /// </summary>
    public async Task<IReadOnlyList<BatchRow>> ListChangedAsync(
        long afterSeq, DateTimeOffset? updatedAfter, string? stationId, int limit, CancellationToken cancellationToken)
    {
        var changedAfter = updatedAfter is null ? "" : """
              AND b.updated_at > @updatedAfter
              AND b.last_event_seq >= (SELECT w.last_event_seq FROM batches w WHERE w.high_water_at > @updatedAfter
                                       ORDER BY w.high_water_at, w.last_event_seq LIMIT 1)
            """;
        await using var connection = await database.OpenAsync(cancellationToken);
        var rows = await connection.QueryAsync<BatchRow>(new CommandDefinition($"""
            {SelectBatch}
            WHERE b.last_event_seq > @afterSeq
            {changedAfter}
              AND (@stationId IS NULL OR b.station_id = @stationId)
            ORDER BY b.last_event_seq
            LIMIT @limit
            """, new { afterSeq, updatedAfter = updatedAfter is { } u ? TimeText.Format(u) : null, stationId, limit }, cancellationToken: cancellationToken));
        return [.. rows];
    }

    public async Task<IReadOnlyList<EventRow>> EventsAsync(string batchId, long afterSeq, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        var rows = await connection.QueryAsync<EventRow>(new CommandDefinition(
            "SELECT seq, batch_id, type, body, occurred_at FROM batch_events WHERE batch_id = @batchId AND seq > @afterSeq ORDER BY seq",
            new { batchId, afterSeq }, cancellationToken: cancellationToken));
        return [.. rows];
    }

    /// <summary>A batch's events with their audit columns, oldest first, and its additions and corrections by id, read on one connection.</summary>
    public async Task<(IReadOnlyList<EventRow> Events, IReadOnlyDictionary<string, AdditionRow> Additions, IReadOnlyDictionary<string, CorrectionRow> Corrections)> AuditTrailAsync(
        string batchId, CancellationToken cancellationToken)
    {
        await using var connection = await database.OpenAsync(cancellationToken);
        var events = await connection.QueryAsync<EventRow>(new CommandDefinition("""
            SELECT seq, batch_id, type, body, occurred_at, actor_key_id, station_id, addition_id, correction_id, prev_hash, hash
            FROM batch_events WHERE batch_id = @batchId ORDER BY seq
            """, new { batchId }, cancellationToken: cancellationToken));
        var additions = await connection.QueryAsync<AdditionRow>(new CommandDefinition($"{SelectAddition} WHERE batch_id = @batchId", new { batchId }, cancellationToken: cancellationToken));
        // Without the join: a correction whose event row was tampered with must still be found by its own id.
        var corrections = await connection.QueryAsync<CorrectionRow>(new CommandDefinition(
            $"SELECT {CorrectionColumns} FROM addition_corrections c WHERE c.batch_id = @batchId", new { batchId }, cancellationToken: cancellationToken));
        return ([.. events], additions.ToDictionary(a => a.AdditionId, StringComparer.Ordinal),
            corrections.ToDictionary(c => c.CorrectionId, StringComparer.Ordinal));
    }

    private async Task<WriteOutcome> WriteVersionedAsync(VersionedWrite write, CancellationToken cancellationToken)
    {
        using var turn = await database.EnterWriteAsync(cancellationToken);
        await using var connection = await database.OpenAsync(cancellationToken);
        var draft = new EventRow
        {
            BatchId = write.BatchId, Type = write.EventType, Body = write.EventBody, OccurredAt = TimeText.Format(write.At),
            ActorKeyId = write.Audit.ActorKeyId, StationId = write.Audit.StationId, AdditionId = write.Addition?.AdditionId ?? "",
            CorrectionId = write.Correction?.CorrectionId ?? "",
        };
        try
        {
            if (database.Engine == PostgresDatabase.EngineName)
            {
                // One statement, so its own transaction: no BEGIN or COMMIT for PostgreSQL to run besides it.
                var seq = await connection.ExecuteScalarAsync<long?>(new CommandDefinition(PostgresWrite(write), PostgresWriteParameters(write, draft), cancellationToken: cancellationToken));
                return seq is { } written ? new WriteOutcome(true, written) : WriteOutcome.Conflict;
            }

            await using var transaction = await connection.BeginTransactionAsync(cancellationToken);
            // Taking the batch row first serialises writers of one batch; the loser sees no row and re-reads. Once the row
            // is ours no other event of this batch can be appended, so its latest hash comes in the same round trip.
            var (claimed, prevHash) = await ClaimAsync(connection, transaction, write.BatchId, write.ExpectedVersion, write.At, cancellationToken);
            if (!claimed)
            {
                return WriteOutcome.Conflict;
            }

            if (write.Insert is not null)
            {
                await connection.ExecuteAsync(new CommandDefinition(write.Insert, write.Row, transaction, cancellationToken: cancellationToken));
            }

            if (write.Replan is { } replan)
            {
                await connection.ExecuteAsync(new CommandDefinition($"{InsertReplan}; UPDATE batches SET plan_revision = @replanRevision WHERE id = @replanBatchId", ReplanParameters(replan), transaction, cancellationToken: cancellationToken));
            }

            if (write.Status is { } status)
            {
                await connection.ExecuteAsync(new CommandDefinition(
                    "UPDATE batches SET status = @status, abort_reason = @abortReason WHERE id = @batchId",
                    new { status = status.Name, abortReason = status.AbortReason, batchId = write.BatchId }, transaction, cancellationToken: cancellationToken));
            }

            var seqOnSqlite = await EventLog.AppendAndCommitAsync(
                database, connection, transaction, prevHash, next => Numbered(draft, next), write.Addition, write.Correction, cancellationToken);
            return new WriteOutcome(true, seqOnSqlite);
        }
        catch (DbException e) when (database.IsConflict(e))
        {
            return WriteOutcome.Conflict;
        }
    }

    private const string InsertReplan = """
        INSERT INTO plan_revisions (batch_id, revision, plan, scale_factor, cause_addition_id, created_at)
        SELECT @replanBatchId, @replanRevision, @replanPlan, @replanScaleFactor, @replanCause, @replanCreatedAt
        """;

    private static object ReplanParameters(PlanRevisionRow replan) => new
    {
        replanBatchId = replan.BatchId, replanRevision = replan.Revision, replanPlan = replan.Plan, replanScaleFactor = replan.ScaleFactor,
        replanCause = replan.CauseAdditionId, replanCreatedAt = replan.CreatedAt,
    };

    /// <summary>
    /// The whole write as one statement and COMMIT, one round trip. <c>claim</c> locks the batch row only if it is still
    /// at the expected version (in READ COMMITTED a row changed meanwhile is re-checked after the lock, so the loser
    /// gets no row); every insert and the counter bump read from it, so a writer that lost writes nothing. A claimed row
    /// had no event appended since this statement's snapshot (every event bumps the version), so the latest hash read
    /// in that snapshot is the batch's latest. The final UPDATE of the locked row bumps the version and sets the rest.
    /// </summary>
    private static string PostgresWrite(VersionedWrite write)
    {
        var before = new List<string>
        {
            "claim AS MATERIALIZED (SELECT id FROM batches WHERE id = @eventBatchId AND version = @expectedVersion FOR UPDATE)",
            "prev AS (SELECT COALESCE((SELECT hash FROM batch_events WHERE batch_id = @eventBatchId ORDER BY seq DESC LIMIT 1), '') AS hash FROM claim)",
        };
        var sets = "version = version + 1, updated_at = @eventAt, ";
        // The counter is bumped only once the rows are in (their TOAST compression included): its lock is held to COMMIT,
        // so nothing that can be done before it is done after it. A row that cannot be inserted fails before it, too.
        var mayWrite = "EXISTS (SELECT 1 FROM claim)";
        if (write.Insert is not null)
        {
            before.Add($"written AS ({write.Insert} FROM claim RETURNING 1)");
            mayWrite += " AND EXISTS (SELECT 1 FROM written)";
        }

        if (write.Replan is not null)
        {
            before.Add($"replan AS ({InsertReplan} FROM claim RETURNING 1)");
            mayWrite += " AND EXISTS (SELECT 1 FROM replan)";
            sets += "plan_revision = @replanRevision, ";
        }

        if (write.Status is not null)
        {
            sets += "status = @status, abort_reason = @abortReason, ";
        }

        return EventLog.PostgresAppend(string.Join(",\n", before), mayWrite, sets);
    }

    private static DynamicParameters PostgresWriteParameters(VersionedWrite write, EventRow draft)
    {
        var parameters = EventLog.PostgresParameters(draft, write.Addition, write.Correction);
        parameters.Add("expectedVersion", write.ExpectedVersion);
        if (write.Row is not null)
        {
            parameters.AddDynamicParams(write.Row);
        }

        if (write.Replan is { } replan)
        {
            parameters.AddDynamicParams(ReplanParameters(replan));
        }

        if (write.Status is { } status)
        {
            parameters.AddDynamicParams(new { status = status.Name, abortReason = status.AbortReason });
        }

        return parameters;
    }

    private static EventRow Numbered(EventRow draft, long seq) => new()
    {
        Seq = seq, BatchId = draft.BatchId, Type = draft.Type, Body = draft.Body, OccurredAt = draft.OccurredAt, ActorKeyId = draft.ActorKeyId,
        StationId = draft.StationId, AdditionId = draft.AdditionId, CorrectionId = draft.CorrectionId,
    };

    private static async Task<(bool Claimed, string PrevHash)> ClaimAsync(
        DbConnection connection, DbTransaction transaction, string batchId, long expectedVersion, DateTimeOffset at, CancellationToken cancellationToken)
    {
        await using var reads = await connection.QueryMultipleAsync(new CommandDefinition("""
            UPDATE batches SET version = version + 1, updated_at = @at WHERE id = @batchId AND version = @expectedVersion RETURNING version;
            SELECT hash FROM batch_events WHERE batch_id = @batchId ORDER BY seq DESC LIMIT 1
            """, new { at = TimeText.Format(at), batchId, expectedVersion }, transaction, cancellationToken: cancellationToken));
        var claimed = (await reads.ReadAsync<long>()).Any();
        return (claimed, await reads.ReadSingleOrDefaultAsync<string?>() ?? "");
    }

    /// <summary>
    /// One version-checked write of a batch: the row it inserts (an addition or a correction, as INSERT … SELECT so
    /// PostgreSQL can make it conditional on the claim), a re-plan, a status change, and its event.
    /// </summary>
    private sealed record VersionedWrite(string BatchId, long ExpectedVersion, DateTimeOffset At, string EventType, string EventBody, EventAudit Audit)
    {
        public string? Insert { get; init; }
        public object? Row { get; init; }
        public AdditionRow? Addition { get; init; }
        public CorrectionRow? Correction { get; init; }
        public PlanRevisionRow? Replan { get; init; }
        public (string Name, string AbortReason)? Status { get; init; }
    }

    private static async Task<(long Id, long Revision)> RecipeRevisionAsync(DbConnection connection, DbTransaction transaction, NewBatch batch, CancellationToken cancellationToken)
    {
        var latest = await connection.QuerySingleOrDefaultAsync<(long Id, long Revision, string ContentHash)?>(new CommandDefinition(
            "SELECT id, CAST(revision AS BIGINT), content_hash FROM recipe_revisions WHERE name = @RecipeName ORDER BY revision DESC LIMIT 1",
            new { batch.RecipeName }, transaction, cancellationToken: cancellationToken));
        if (latest is { } same && same.ContentHash == batch.RecipeHash)
        {
            return (same.Id, same.Revision);
        }

        var revision = (latest?.Revision ?? 0) + 1;
        var id = await connection.ExecuteScalarAsync<long>(new CommandDefinition("""
            INSERT INTO recipe_revisions (name, revision, content_hash, body, created_at)
            VALUES (@RecipeName, @revision, @RecipeHash, @RecipeBody, @at) RETURNING id
            """, new { batch.RecipeName, revision, batch.RecipeHash, batch.RecipeBody, at = TimeText.Format(batch.At) },
            transaction, cancellationToken: cancellationToken));
        return (id, revision);
    }
}
