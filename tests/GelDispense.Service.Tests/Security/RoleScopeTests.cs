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

    [Theory, SqliteEngine]
    public async Task A_station_key_needs_a_station_id(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var problem = await Demo.PostAsync(host.CreateClient(), "/v1/api-keys", """{"role":"station"}""", 400);
        Assert.Contains("stationId", problem.ToJsonString(), StringComparison.Ordinal);
        using var response = await host.CreateClient().GetAsync("/v1/api-keys");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
    }
}
