using GelDispense.Contracts.V1;
using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Mapping;

[Collection(ApiCollection.Name)]
public sealed class PlanOptionsMappingTests(ApiHosts hosts)
{
    private static string PlanBody(string options, string recipe = Demo.DensityRecipe) =>
        $$"""{"recipe":{{recipe}},"balance":{{Demo.Balance}},"options":{{options}}}""";

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Bad_options_are_400s_naming_the_option(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();

        var mode = await Demo.PostAsync(client, "/v1/plans", PlanBody("""{"toleranceMode":"best-guess"}"""), 400);
        var limit = await Demo.PostAsync(client, "/v1/plans", PlanBody("""{"defaultStepLimitPct":80}"""), 400);
        var vessel = await Demo.PostAsync(client, "/v1/batches",
            $$$"""{"stationId":"bench-opt","recipe":{{{Demo.Recipe}}},"balance":{{{Demo.Balance}}},"options":{"vesselCapacityMl":-5}}""", 400);

        Assert.Equal("options.toleranceMode", (string)mode["errors"]![0]!["field"]!);
        Assert.Contains("root-sum-square", (string)mode["errors"]![0]!["reason"]!, StringComparison.Ordinal);
        Assert.Equal("options.defaultStepLimitPct", (string)limit["errors"]![0]!["field"]!);
        Assert.Equal("options.vesselCapacityMl", (string)vessel["errors"]![0]!["field"]!);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Cumulative_readings_are_running_sums_of_the_step_readings_only_when_asked_for(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();

        var retared = await Demo.PostAsync(client, "/v1/plans", PlanBody("{}"));
        var cumulative = await Demo.PostAsync(client, "/v1/plans", PlanBody("""{"cumulative":true}"""));

        var running = 0.0;
        foreach (var step in cumulative["steps"]!.AsArray())
        {
            running += (double)step!["targetReadingG"]!;
            Assert.Equal(running, (double)step["cumulativeReadingG"]!, 9);
        }

        Assert.All(retared["steps"]!.AsArray(), s => Assert.Equal((double)s!["targetReadingG"]!, (double)s["cumulativeReadingG"]!));
        Assert.True(running > (double)cumulative["steps"]![0]!["targetReadingG"]! * 1.5);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Root_sum_square_windows_are_no_narrower_than_worst_case_ones(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();

        var worst = (await Demo.PostAsync(client, "/v1/plans", PlanBody("""{"toleranceMode":"worst-case"}""")))["steps"]!.AsArray();
        var rss = (await Demo.PostAsync(client, "/v1/plans", PlanBody("""{"toleranceMode":"root-sum-square"}""")))["steps"]!.AsArray();

        // Errors that add in quadrature (root-sum-square, as in the GUM's law of propagation) never exceed their plain
        // sum, so the same tolerance admits windows at least as wide.
        Assert.Equal(worst.Count, rss.Count);
        Assert.All(worst.Zip(rss), p => Assert.True((double)p.Second!["toleranceG"]! >= (double)p.First!["toleranceG"]! * (1 - 1e-9)));
        Assert.True(rss.Sum(s => (double)s!["toleranceG"]!) > worst.Sum(s => (double)s!["toleranceG"]!));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_batch_in_a_vessel_with_little_headroom_re_plans_to_what_fits_and_says_so(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var planned = await Demo.PostAsync(client, "/v1/plans", PlanBody("{}"));
        var capacityMl = (double)planned["predicted"]!["gelVolumeMl"]! * 1.01;
        var batch = await Demo.PostAsync(client, "/v1/batches",
            $$$"""{"stationId":"bench-opt","recipe":{{{Demo.DensityRecipe}}},"balance":{{{Demo.Balance}}},"options":{"vesselCapacityMl":{{{capacityMl.ToString("R", System.Globalization.CultureInfo.InvariantCulture)}}}}}""");
        var id = (string)batch["id"]!;

        // 5 % over on the first precursor needs a batch 5 % larger to restore the composition; only 1 % fits.
        var result = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("cap1", 0, (double)batch["steps"]![0]!["targetReadingG"]! * 1.05));
        var stored = await new BatchService.BatchServiceClient(host.Channel()).GetBatchAsync(new GetBatchRequest { Id = id });

        Assert.True((bool)result["replanned"]!);
        Assert.Equal(capacityMl, (double)result["predictedFinal"]!["gelVolumeMl"]!, tolerance: capacityMl * 1e-9);
        Assert.Contains(result["warnings"]!.AsArray(), w => ((string)w!).Contains("capacity", StringComparison.Ordinal));
        Assert.False((bool?)result["predictedWithinSpec"] ?? false);
        Assert.Equal(capacityMl, stored.Options.VesselCapacityMl, 9);
    }
}
