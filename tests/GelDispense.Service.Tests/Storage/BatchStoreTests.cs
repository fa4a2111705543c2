using Dapper;
using GelDispense.Service.Storage;
using GelDispense.Service.Tests.Infrastructure;
using Microsoft.Extensions.DependencyInjection;

namespace GelDispense.Service.Tests.Storage;

[Collection(ApiCollection.Name)]
public sealed class BatchStoreTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task Re_plans_are_appended_as_revisions_and_the_first_plan_is_never_rewritten(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var batch = await Demo.StartBatchAsync(client);
        var id = (string)batch["id"]!;
        var database = host.Services.GetRequiredService<IDatabase>();
        var firstPlan = await FirstPlanAsync(database, id);

        var teosReading = (double)batch["steps"]![0]!["targetReadingG"]!;
        await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("h1", 0, teosReading * 1.03));
        var afterFirst = await Demo.GetAsync(client, $"/v1/batches/{id}");
        var ethanolReading = (double)afterFirst["steps"]![1]!["targetReadingG"]!;
        await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("h2", 1, ethanolReading * 1.10));

        await using var connection = await database.OpenAsync(CancellationToken.None);
        var revisions = (await connection.QueryAsync<(long Revision, string Cause, string Plan)>(
            "SELECT revision, cause_addition_id, plan FROM plan_revisions WHERE batch_id = @id ORDER BY revision", new { id })).ToArray();
        Assert.Equal([(1L, "h1"), (2L, "h2")], revisions.Select(r => (r.Revision, r.Cause)));
        Assert.Equal(firstPlan, await FirstPlanAsync(database, id));
        var judged = (await connection.QueryAsync<(string AdditionId, long PlanRevision)>(
            "SELECT addition_id, plan_revision FROM additions WHERE batch_id = @id ORDER BY ordinal", new { id })).ToArray();
        Assert.Equal([("h1", 0L), ("h2", 1L)], judged);
        var current = await Demo.GetAsync(client, $"/v1/batches/{id}");
        Assert.Equal(2, (int)current["planRevision"]!);
        var latest = Google.Protobuf.JsonParser.Default.Parse<Contracts.V1.DispensingPlan>(revisions[1].Plan);
        Assert.Equal(latest.Steps[2].TargetMassG, (double)current["steps"]![2]!["targetMassG"]!, 12);
        Assert.NotEqual((double)batch["steps"]![2]!["targetMassG"]!, latest.Steps[2].TargetMassG, 6);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Changed_after_a_time_finds_a_batch_stamped_later_than_batches_after_it_in_event_order(string engine)
    {
        // Replicas' clocks differ, and a writer reads its clock before it takes its sequence number, so a batch later
        // in event order can carry an earlier time. Every batch changed after the time must still be listed, in event order.
        var host = await hosts.ServiceHostOnNewDatabaseAsync(engine);
        await using var _ = host;
        var store = host.Services.GetRequiredService<BatchStore>();
        var nine = new DateTimeOffset(2026, 3, 2, 9, 0, 0, TimeSpan.Zero);
        foreach (var (id, minutes) in new[] { ("b-early", 0), ("b-ahead", 60), ("b-behind", 40), ("b-late", 50) })
        {
            Assert.NotNull(await store.TryCreateAsync(new NewBatch(id, "st-1", "r", "{}", "h", "{}", "{}", "InProgress", "Created", "{}", nine.AddMinutes(minutes), "k"), CancellationToken.None));
        }

        var moved = await store.TrySetStatusAsync("b-early", 1, "Aborted", "spilled", "Aborted", "{}", nine.AddMinutes(90), new EventAudit("k", "st-1"), CancellationToken.None);
        Assert.True(moved.Written);

        async Task<string[]> Changed(int afterMinutes, long afterSeq = 0, int limit = 10) =>
            [.. (await store.ListChangedAsync(afterSeq, nine.AddMinutes(afterMinutes), null, limit, CancellationToken.None)).Select(r => r.Id)];
        // Starting from the earliest time after 09:30 (b-behind) would skip b-ahead, which is before it in event order.
        Assert.Equal(["b-ahead", "b-behind", "b-late", "b-early"], await Changed(30));
        Assert.Equal(["b-ahead", "b-late", "b-early"], await Changed(45));
        Assert.Equal(["b-early"], await Changed(60));
        Assert.Empty(await Changed(90));
        Assert.Equal(["b-ahead"], await Changed(30, limit: 1));
        var behindSeq = (await store.FindAsync("b-behind", CancellationToken.None))!.LastEventSeq;
        Assert.Equal(["b-late", "b-early"], await Changed(30, behindSeq));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_write_that_loses_the_version_race_or_repeats_an_addition_id_writes_nothing_and_takes_no_event_number(string engine)
    {
        var host = await hosts.ServiceHostOnNewDatabaseAsync(engine);
        await using var _ = host;
        var store = host.Services.GetRequiredService<BatchStore>();
        var database = host.Services.GetRequiredService<IDatabase>();
        var nine = new DateTimeOffset(2026, 3, 2, 9, 0, 0, TimeSpan.Zero);
        var audit = new EventAudit("k", "st-1");
        Assert.NotNull(await store.TryCreateAsync(new NewBatch("b-1", "st-1", "r", "{}", "h", "{}", "{}", "InProgress", "Created", "{}", nine, "k"), CancellationToken.None));
        Assert.True((await store.TryAppendAdditionAsync(Addition("a-1", 0), 1, Replan(1, "a-1"), "{}", nine.AddMinutes(1), audit, CancellationToken.None)).Written);
        var before = await StateAsync(database);

        var stale = await store.TryAppendAdditionAsync(Addition("a-2", 1), 1, Replan(2, "a-2"), "{}", nine.AddMinutes(2), audit, CancellationToken.None);
        var repeated = await store.TryAppendAdditionAsync(Addition("a-1", 1), 2, Replan(2, "a-1"), "{}", nine.AddMinutes(2), audit, CancellationToken.None);
        var staleStatus = await store.TrySetStatusAsync("b-1", 1, "Aborted", "spilled", "Aborted", "{}", nine.AddMinutes(2), audit, CancellationToken.None);

        Assert.Equal(WriteOutcome.Conflict, stale);
        Assert.Equal(WriteOutcome.Conflict, repeated);
        Assert.Equal(WriteOutcome.Conflict, staleStatus);
        Assert.Equal(before, await StateAsync(database));
        Assert.Equal((2L, 2L, 1L, 1L, 2L, "InProgress", 1L), before);
        var next = await store.TryAppendAdditionAsync(Addition("a-2", 1), 2, null, "{}", nine.AddMinutes(3), audit, CancellationToken.None);
        Assert.Equal(new WriteOutcome(true, 3), next);

        static AdditionRow Addition(string id, long ordinal) => new()
        {
            BatchId = "b-1", AdditionId = id, Ordinal = ordinal, StepIndex = ordinal, ReadingG = 1.5, Stable = true, Source = "balance", LotId = "L1",
            TrueMassG = 1.5, WithinWindow = false, RecordedAt = "2026-03-02T09:01:00.0000000Z", ContentHash = id, Response = "{}",
        };
        static PlanRevisionRow Replan(long revision, string cause) => new()
        {
            BatchId = "b-1", Revision = revision, Plan = "{}", ScaleFactor = 1.1, CauseAdditionId = cause, CreatedAt = "2026-03-02T09:01:00.0000000Z",
        };
    }

    // Batch version, event counter, additions, plan revisions, events, status and plan revision in force of b-1.
    private static async Task<(long, long, long, long, long, string, long)> StateAsync(IDatabase database)
    {
        await using var connection = await database.OpenAsync(CancellationToken.None);
        return await connection.QuerySingleAsync<(long, long, long, long, long, string, long)>("""
            SELECT b.version, (SELECT last_seq FROM event_sequence WHERE id = 1), (SELECT COUNT(*) FROM additions),
                   (SELECT COUNT(*) FROM plan_revisions), (SELECT COUNT(*) FROM batch_events), b.status, b.plan_revision
            FROM batches b WHERE b.id = 'b-1'
            """);
    }

    private static async Task<string> FirstPlanAsync(IDatabase database, string id)
    {
        await using var connection = await database.OpenAsync(CancellationToken.None);
        return await connection.QuerySingleAsync<string>("SELECT plan FROM batches WHERE id = @id", new { id });
    }
}
