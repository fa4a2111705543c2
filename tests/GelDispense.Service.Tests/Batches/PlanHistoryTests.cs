using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;

namespace GelDispense.Service.Tests.Batches;

[Collection(ApiCollection.Name)]
public sealed class PlanHistoryTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task After_an_over_pour_both_revisions_read_back_as_stored_and_each_addition_matches_the_one_it_was_judged_against(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var batch = await Demo.StartBatchAsync(client, stationId: "bench-hist", recipe: Demo.DensityRecipe);
        var id = (string)batch["id"]!;
        var steps = batch["steps"]!.AsArray();
        const double overPour = 1.05;
        var over = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("h1", 0, (double)steps[0]!["targetReadingG"]! * overPour));
        var next = over["remainingSteps"]![0]!;
        var onTarget = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("h2", (int)next["index"]!, (double)next["targetReadingG"]!));

        var first = await Demo.GetAsync(client, $"/v1/batches/{id}/plans/0");
        var replan = await Demo.GetAsync(client, $"/v1/batches/{id}/plans/1");

        // Revision 0 is the plan the batch started with, unchanged by the re-plan.
        Assert.Equal(0, (int?)first["revision"] ?? 0);
        Assert.Equal(1.0, (double)first["scaleFactor"]!);
        Assert.Equal((double)steps[1]!["targetMassG"]!, (double)first["plan"]!["steps"]![1]!["targetMassG"]!, 12);
        // Revision 1: caused by the over-pour, scaled by its factor (R and density are mass ratios), first step done.
        Assert.Equal("h1", (string)replan["causeAdditionId"]!);
        Assert.Equal(overPour, (double)replan["scaleFactor"]!, 6);
        Assert.True((bool)replan["plan"]!["steps"]![0]!["done"]!);
        Assert.Equal((double)steps[1]!["targetMassG"]! * overPour, (double)replan["plan"]!["steps"]![1]!["targetMassG"]!, 6);
        // Each addition carries the revision and the target it was judged against; the revisions show the same targets.
        Assert.Equal((0, 1), ((int?)over["addition"]!["planRevision"] ?? 0, (int)onTarget["addition"]!["planRevision"]!));
        Assert.Equal((double)first["plan"]!["steps"]![0]!["targetMassG"]!, (double)over["addition"]!["targetMassG"]!, 12);
        var judged = replan["plan"]!["steps"]!.AsArray().Single(s => (int)s!["index"]! == (int)next["index"]!)!;
        Assert.Equal((double)judged["targetMassG"]!, (double)onTarget["addition"]!["targetMassG"]!, 12);
        Assert.Equal((double)judged["acceptanceG"]!, (double)onTarget["addition"]!["acceptanceG"]!, 12);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_revision_the_batch_does_not_have_is_a_404_naming_the_revisions_it_has(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var id = (string)(await Demo.StartBatchAsync(client, stationId: "bench-hist"))["id"]!;

        var problem = await Demo.GetAsync(client, $"/v1/batches/{id}/plans/3", 404);
        var unknown = await Demo.GetAsync(client, "/v1/batches/b-no-such-batch/plans/0", 404);

        Assert.Equal("revision", (string)problem["errors"]![0]!["field"]!);
        Assert.Contains("0 to 0", (string)problem["errors"]![0]!["reason"]!, StringComparison.Ordinal);
        Assert.Equal("batchId", (string)unknown["errors"]![0]!["field"]!);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_station_key_reads_its_own_batches_plans_over_gRPC_and_is_refused_another_stations(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var id = (string)(await Demo.StartBatchAsync(host.CreateClient(), stationId: "bench-hist-a"))["id"]!;
        var own = new BatchService.BatchServiceClient(host.Channel(await host.IssueKeyAsync(Roles.Station, "bench-hist-a")));
        var other = new BatchService.BatchServiceClient(host.Channel(await host.IssueKeyAsync(Roles.Station, "bench-hist-b")));

        var revision = await own.GetPlanRevisionAsync(new GetPlanRevisionRequest { BatchId = id, Revision = 0 });
        var refused = await Assert.ThrowsAsync<RpcException>(() => other.GetPlanRevisionAsync(new GetPlanRevisionRequest { BatchId = id, Revision = 0 }).ResponseAsync);

        Assert.Equal(id, revision.BatchId);
        Assert.Equal("teos", revision.Plan.Steps[0].ReagentId);
        Assert.Equal(StatusCode.PermissionDenied, refused.StatusCode);
    }
}
