using Dapper;
using GelDispense.Service.Batches;
using GelDispense.Service.Tests.Infrastructure;
using Microsoft.Extensions.DependencyInjection;

namespace GelDispense.Service.Tests.Batches;

[Collection(ApiCollection.Name)]
public sealed class BatchPlanCacheTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_batch_started_here_has_its_chemistry_from_its_creation_so_its_first_addition_does_not_read_its_stored_setup(string engine)
    {
        var host = await hosts.ServiceHostOnNewDatabaseAsync(engine);
        await using var _ = host;
        var client = host.CreateClient();
        var batch = await Demo.StartBatchAsync(client);
        var id = (string)batch["id"]!;
        await using (var raw = await RawDatabase.OpenAsync(host))
        {
            // Unreadable now: a first addition that rebuilt the chemistry from the stored origin would fail on it.
            Assert.Equal(1, await raw.ExecuteAsync("UPDATE batches SET setup = 'not a setup' WHERE id = @id", new { id }));
        }

        var teosReading = (double)batch["steps"]![0]!["targetReadingG"]!;
        var recorded = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("p1", 0, teosReading));
        Assert.True((bool)recorded["addition"]!["withinWindow"]!);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Batches_started_from_the_same_recipe_on_the_same_devices_share_one_chemistry_basis(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var first = (string)(await Demo.StartBatchAsync(client))["id"]!;
        var second = (string)(await Demo.StartBatchAsync(client, stationId: "bench-3"))["id"]!;
        var other = (string)(await Demo.StartBatchAsync(client, recipe: Demo.DensityRecipe))["id"]!;

        var plans = host.Services.GetRequiredService<BatchPlanCache>();
        var basis = await plans.BasisAsync(first, CancellationToken.None);
        Assert.Same(basis, await plans.BasisAsync(second, CancellationToken.None));
        Assert.NotSame(basis, await plans.BasisAsync(other, CancellationToken.None));
    }
}
