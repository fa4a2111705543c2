using System.Text.Json.Nodes;
using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Batches;

[Collection(ApiCollection.Name)]
public sealed class BatchLedgerTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_new_batch_is_answered_exactly_as_it_reads_back_for_a_new_recipe_and_for_a_recipe_revision_already_stored(string engine)
    {
        var host = await hosts.ServiceHostOnNewDatabaseAsync(engine);
        await using var _ = host;
        var client = host.CreateClient();
        foreach (var stationId in new[] { "bench-2", "bench-3" })
        {
            var created = await Demo.StartBatchAsync(client, stationId);
            var readBack = await Demo.GetAsync(client, $"/v1/batches/{(string)created["id"]!}");
            Assert.True(JsonNode.DeepEquals(readBack, created), $"created {created.ToJsonString()}\nread back {readBack.ToJsonString()}");
        }
    }
}
