using System.Net;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;

namespace GelDispense.Service.Tests.Security;

[Collection(ApiCollection.Name)]
public sealed class RoleScopeTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_lims_key_reads_but_may_not_plan_or_write_the_catalog(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var lims = host.ClientWith(await host.IssueKeyAsync(Roles.Lims));
        await Demo.GetAsync(lims, "/v1/batches");
        await Demo.PostAsync(lims, "/v1/plans", $$"""{"recipe":{{Demo.Recipe}},"balance":{{Demo.Balance}}}""", 403);
        await Demo.PostAsync(lims, "/v1/api-keys", """{"role":"admin"}""", 403);

        var grpc = new PlanService.PlanServiceClient(host.Channel(await host.IssueKeyAsync(Roles.Lims)));
        var refused = await Assert.ThrowsAsync<RpcException>(() => grpc.CreatePlanAsync(new CreatePlanRequest()).ResponseAsync);
        Assert.Equal(StatusCode.PermissionDenied, refused.StatusCode);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_station_key_may_not_start_or_write_another_stations_batch(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var stationA = host.ClientWith(await host.IssueKeyAsync(Roles.Station, "bench-a"));
        var stationB = host.ClientWith(await host.IssueKeyAsync(Roles.Station, "bench-b"));
        var batch = await Demo.StartBatchAsync(stationA, "bench-a");
        await Demo.PostAsync(stationA, "/v1/batches", $$"""{"stationId":"bench-b","recipe":{{Demo.Recipe}},"balance":{{Demo.Balance}}}""", 403);

        var step = batch["steps"]![0]!;
        var addition = Demo.Addition("b-try", (int)step["index"]!, (double)step["targetReadingG"]!);
        var problem = await Demo.PostAsync(stationB, $"/v1/batches/{batch["id"]}/additions", addition, 403);
        Assert.Contains("bench-b", problem.ToJsonString(), StringComparison.Ordinal);
        await Demo.PostAsync(stationB, $"/v1/batches/{batch["id"]}:abort", """{"reason":"not mine"}""", 403);
        await Demo.PostAsync(stationA, $"/v1/batches/{batch["id"]}/additions", addition);

        var grpc = new BatchService.BatchServiceClient(host.Channel(await host.IssueKeyAsync(Roles.Station, "bench-b")));
        var refused = await Assert.ThrowsAsync<RpcException>(() => grpc.CompleteBatchAsync(new CompleteBatchRequest { Id = (string)batch["id"]! }).ResponseAsync);
        Assert.Equal(StatusCode.PermissionDenied, refused.StatusCode);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_station_key_reads_only_its_own_stations_batches_while_a_lims_key_reads_all(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var stationA = host.ClientWith(await host.IssueKeyAsync(Roles.Station, "bench-ra"));
        var stationB = host.ClientWith(await host.IssueKeyAsync(Roles.Station, "bench-rb"));
        var lims = host.ClientWith(await host.IssueKeyAsync(Roles.Lims));
        var batchA = (string)(await Demo.StartBatchAsync(stationA, "bench-ra"))["id"]!;
        var batchB = (string)(await Demo.StartBatchAsync(stationB, "bench-rb"))["id"]!;

        await Demo.GetAsync(stationA, $"/v1/batches/{batchA}");
        await Demo.GetAsync(stationA, $"/v1/batches/{batchA}/as-made");
        await Demo.GetAsync(stationB, $"/v1/batches/{batchA}", 403);
        await Demo.GetAsync(stationB, $"/v1/batches/{batchA}/as-made", 403);
        await Demo.GetAsync(stationB, "/v1/batches?stationId=bench-ra", 403);
        using (var csv = await stationB.GetAsync($"/v1/batches:export-csv?batchId={batchA}"))
        {
            Assert.Equal(HttpStatusCode.Forbidden, csv.StatusCode);
        }

        var seenByB = await AllIdsAsync(stationB);
        Assert.Contains(batchB, seenByB);
        Assert.DoesNotContain(batchA, seenByB);
        var seenByLims = await AllIdsAsync(lims);
        Assert.Contains(batchA, seenByLims);
        Assert.Contains(batchB, seenByLims);

        var watch = new BatchService.BatchServiceClient(host.Channel(await host.IssueKeyAsync(Roles.Station, "bench-rb")))
            .WatchBatch(new WatchBatchRequest { BatchId = batchA });
        var refused = await Assert.ThrowsAsync<RpcException>(() => watch.ResponseStream.MoveNext(CancellationToken.None));
        Assert.Equal(StatusCode.PermissionDenied, refused.StatusCode);
    }

    [Theory, SqliteEngine]
    public async Task A_station_key_needs_a_station_id(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var problem = await Demo.PostAsync(host.CreateClient(), "/v1/api-keys", """{"role":"station"}""", 400);
        Assert.Contains("stationId", problem.ToJsonString(), StringComparison.Ordinal);
        using var response = await host.CreateClient().GetAsync("/v1/api-keys");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }

    private static async Task<List<string>> AllIdsAsync(HttpClient client)
    {
        var ids = new List<string>();
        var token = "";
        bool more;
        do
        {
            var page = await Demo.GetAsync(client, $"/v1/batches?pageSize=200&pageToken={token}");
            ids.AddRange(page["batches"]?.AsArray().Select(b => (string)b!["id"]!) ?? []);
            token = (string?)page["nextPageToken"] ?? "";
            more = (bool?)page["hasMore"] ?? false;
        }
        while (more);
        return ids;
    }
}
