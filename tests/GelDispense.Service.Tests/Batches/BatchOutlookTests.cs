using System.Text.Json.Nodes;
using GelDispense.Contracts.V1;
using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Batches;

[Collection(ApiCollection.Name)]
public sealed class BatchOutlookTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task An_over_pour_of_the_first_precursor_scales_the_remaining_targets_by_its_factor_and_keeps_R_and_density_at_spec(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var batch = await Demo.StartBatchAsync(client, recipe: Demo.DensityRecipe);
        var id = (string)batch["id"]!;
        var steps = batch["steps"]!.AsArray();
        var teos = steps[0]!;
        Assert.Equal("teos", (string)teos["reagentId"]!);
        const double overPour = 1.05;

        // Buoyancy is a constant factor per reagent, so 5 % over on the reading is 5 % over on the true mass.
        var result = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("op1", 0, (double)teos["targetReadingG"]! * overPour));

        Assert.False((bool)result["addition"]!["withinWindow"]!);
        Assert.True((bool)result["replanned"]!);
        Assert.Equal(1, (int)result["planRevision"]!);
        Assert.Equal(overPour, (double)result["scaleFactor"]!, 6);
        var remaining = result["remainingSteps"]!.AsArray();
        Assert.Equal(["ethanol", "water"], remaining.Select(s => (string)s!["reagentId"]!));
        foreach (var step in remaining)
        {
            // R and the oxide density are ratios of masses (R: mol H2O per mol Si, the definition in published-values §9),
            // so the composition holds when every other mass grows by the over-pour factor.
            var first = steps.Single(s => (int)s!["index"]! == (int)step!["index"]!)!;
            Assert.Equal((double)first["targetMassG"]! * overPour, (double)step!["targetMassG"]!, 6);
        }

        var predicted = result["predictedFinal"]!;
        Assert.Equal(4.0, (double)predicted["hydrolysisRatio"]!, 6);
        Assert.Equal(0.08, (double)predicted["oxideDensityGPerMl"]!, 6);
        // Ideal mixing (design §2): the gel volume is the sum of the component volumes, so it grows by the same factor.
        var firstPlan = await Demo.PostAsync(client, "/v1/plans", $$"""{"recipe":{{Demo.DensityRecipe}},"balance":{{Demo.Balance}}}""");
        Assert.Equal((double)firstPlan["predicted"]!["gelVolumeMl"]! * overPour, (double)predicted["gelVolumeMl"]!, 6);
        Assert.True((bool)result["predictedWithinSpec"]!);
        Assert.All(result["predictedDeviations"]!.AsArray(), d => Assert.True((bool)d!["withinTolerance"]!));

        // The batch now shows the re-planned steps over gRPC too; the first step is done with the mass recorded.
        var stored = await new BatchService.BatchServiceClient(host.Channel()).GetBatchAsync(new GetBatchRequest { Id = id });
        Assert.Equal(1, stored.PlanRevision);
        Assert.True(stored.Steps[0].Done);
        Assert.Equal((double)result["addition"]!["trueMassG"]!, stored.Steps[0].TargetMassG, 9);
        Assert.Equal((double)remaining[1]!["targetMassG"]!, stored.Steps[2].TargetMassG, 9);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_water_over_pour_as_the_last_step_flags_R_outside_spec_in_the_prediction_and_the_as_made_record(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var batch = await Demo.StartBatchAsync(client);
        var id = (string)batch["id"]!;
        var steps = batch["steps"]!.AsArray();
        await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("w-teos", 0, (double)steps[0]!["targetReadingG"]!));
        await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("w-etoh", 1, (double)steps[1]!["targetReadingG"]!));

        var result = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("w-water", 2, (double)steps[2]!["targetReadingG"]! * 1.10));

        Assert.False((bool)result["addition"]!["withinWindow"]!);
        Assert.True((bool)result["replanned"]!);
        Assert.Empty(result["remainingSteps"]!.AsArray());
        Assert.False((bool)result["predictedWithinSpec"]!);
        // 10 % more water on the same TEOS: R = 4 × 1.10 = 4.4, +10 % against the spec's ± 2 % (R definition, published-values §9).
        var predictedR = Single(result["predictedDeviations"]!, "hydrolysisRatio");
        Assert.Equal(4.4, (double)predictedR["actual"]!, 6);
        Assert.Equal(10.0, (double)predictedR["deviationPct"]!, 4);
        Assert.False((bool)predictedR["withinTolerance"]!);
        var asMadeR = Single(result["asMade"]!["deviations"]!, "hydrolysisRatio");
        Assert.False((bool)asMadeR["withinTolerance"]!);
        Assert.False((bool)result["asMade"]!["withinSpec"]!);
        Assert.Contains(result["warnings"]!.AsArray(), w => ((string)w!).Contains("hydrolysisRatio", StringComparison.Ordinal));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task An_addition_inside_its_acceptance_band_keeps_the_plan_and_predicts_the_spec(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var batch = await Demo.StartBatchAsync(client);
        var id = (string)batch["id"]!;
        var teos = batch["steps"]![0]!;

        var result = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("in1", 0, (double)teos["targetReadingG"]!));

        Assert.True((bool)result["addition"]!["withinWindow"]!);
        Assert.False((bool)result["replanned"]!);
        Assert.Equal(0, (int)result["planRevision"]!);
        Assert.Equal(1.0, (double)result["scaleFactor"]!, 12);
        Assert.Equal(batch["steps"]!.AsArray().Skip(1).Select(s => (double)s!["targetMassG"]!), result["remainingSteps"]!.AsArray().Select(s => (double)s!["targetMassG"]!));
        // On target the prediction is the plan's own composition: R = 4 by the recipe's ratios.
        Assert.Equal(4.0, (double)result["predictedFinal"]!["hydrolysisRatio"]!, 9);
        Assert.True((bool)result["predictedWithinSpec"]!);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_mass_inside_the_spec_window_but_outside_the_acceptance_band_is_out_of_window(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var batch = await Demo.StartBatchAsync(client);
        var teos = batch["steps"]![0]!;
        var (target, tolerance, acceptance) = ((double)teos["targetMassG"]!, (double)teos["toleranceG"]!, (double)teos["acceptanceG"]!);
        // Guard banding (common practice; the decision rules of ISO 14253-1, from memory): the band is the window less the device error.
        Assert.InRange(acceptance, 0, tolerance * 0.999);
        var trueMassG = target + ((tolerance + acceptance) / 2);

        var result = await Demo.PostAsync(client, $"/v1/batches/{batch["id"]}/additions",
            Demo.Addition("g1", 0, trueMassG * (double)teos["targetReadingG"]! / target));

        Assert.Equal(trueMassG, (double)result["addition"]!["trueMassG"]!, 9);
        Assert.False((bool)result["addition"]!["withinWindow"]!);
        Assert.True((bool)result["replanned"]!);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Replaying_an_out_of_window_addition_returns_the_same_re_plan_without_a_new_revision(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var batch = await Demo.StartBatchAsync(client);
        var id = (string)batch["id"]!;
        var over = Demo.Addition("rp1", 0, (double)batch["steps"]![0]!["targetReadingG"]! * 1.04);

        var first = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", over);
        var replay = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", over);

        Assert.True((bool)replay["replanned"]!);
        Assert.True((bool)replay["replayed"]!);
        Assert.Equal(first["remainingSteps"]!.ToJsonString(), replay["remainingSteps"]!.ToJsonString());
        Assert.Equal(1, (int)(await Demo.GetAsync(client, $"/v1/batches/{id}"))["planRevision"]!);
    }

    private static JsonNode Single(JsonNode deviations, string quantity) =>
        deviations.AsArray().Single(d => (string)d!["quantity"]! == quantity)!;
}
