using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;

namespace GelDispense.Service.Tests.Errors;

/// <summary>The database failing under the API key check, before any handler runs: UNAVAILABLE on both protocols.</summary>
[Collection(ApiCollection.Name)]
public sealed class DatabaseOutageMiddlewareTests(ApiHosts hosts)
{
    [Theory, PostgresEngine]
    public async Task A_key_check_that_meets_a_cut_database_connection_answers_unavailable_over_REST_and_gRPC(string engine)
    {
        await using var host = await hosts.ServiceHostOnNewDatabaseAsync(engine);
        // Keys never used yet, so their check reads the key store rather than the key cache.
        var restKey = await host.IssueKeyAsync(Roles.Lims);
        var grpcKey = await host.IssueKeyAsync(Roles.Lims);

        Assert.True(await RawDatabase.EndServiceBackendsAsync(host) > 0);
        var refused = await Demo.GetAsync(host.ClientWith(restKey), "/v1/batches?pageSize=1", 503);
        // Once the pool has dropped the ended connection, the same key is let in, on a new one.
        await Demo.GetAsync(host.ClientWith(restKey), "/v1/batches?pageSize=1");
        Assert.True(await RawDatabase.EndServiceBackendsAsync(host) > 0);
        using var channel = host.Channel(grpcKey);
        var ex = await Assert.ThrowsAsync<RpcException>(async () =>
            await new BatchService.BatchServiceClient(channel).ListBatchesAsync(new ListBatchesRequest { PageSize = 1 }));

        Assert.Equal("urn:geldispense:problem:unavailable", (string)refused["type"]!);
        Assert.Equal(StatusCode.Unavailable, ex.StatusCode);
    }
}
