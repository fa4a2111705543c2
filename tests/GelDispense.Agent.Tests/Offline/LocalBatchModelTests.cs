using GelDispense.Agent.Demo;
using GelDispense.Agent.Offline;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Tests.Support;
using GelDispense.Chemistry.Errors;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Tests.Offline;

/// <summary>
/// What the station works out offline must agree with what the service decides online: both use the chemistry
/// library, so for a batch on its first plan the true mass, the window verdict, the re-plan and the as-made record match.
/// </summary>
[Collection(StationCollection.Name)]
public sealed class LocalBatchModelTests : TempDirectoryTest
{
    [Fact]
    public async Task An_over_pour_judged_and_replanned_offline_matches_the_services_answer()
    {
        await using var bench = await ServiceBench.StartAsync(Path.Combine(Dir, "service.db"));
        var batch = bench.Batch;
        var model = LocalBatchModel.Create(batch);
        var teos = batch.Steps[0];
        var readingG = teos.TargetReadingG * 1.03;

        var local = model.Judge(teos, readingG, [], "a-1");
        var online = await bench.Link.RecordAdditionAsync(new RecordAdditionRequest { BatchId = batch.Id, AdditionId = "a-1", StepIndex = 0, ReadingG = readingG, Stable = true }, default);

        Assert.False(local.WithinWindow);
        Assert.False(online.Addition.WithinWindow);
        Assert.Equal(online.Addition.TrueMassG, local.TrueMassG, 9);
        Assert.Equal(online.RemainingSteps.Select(s => s.Index), local.RemainingSteps.Select(s => s.Index));
        foreach (var (fromService, atStation) in online.RemainingSteps.Zip(local.RemainingSteps))
        {
            Assert.Equal(fromService.TargetMassG, atStation.TargetMassG, 6);
            Assert.Equal(fromService.AcceptanceG, atStation.AcceptanceG, 6);
        }

        var made = new MadeAddition("a-1", 0, readingG, local.TrueMassG, false, false);
        var localAsMade = model.AsMade(batch.Id, [made]);
        var serviceAsMade = await bench.Link.GetAsMadeAsync(batch.Id, default);
        Assert.Equal(serviceAsMade.Composition.HydrolysisRatio, localAsMade.Composition.HydrolysisRatio, 9);
        Assert.Equal(serviceAsMade.Composition.OxideDensityGPerMl, localAsMade.Composition.OxideDensityGPerMl, 9);
    }

    [Fact]
    public async Task An_addition_inside_its_window_is_judged_within_and_needs_no_replan()
    {
        await using var bench = await ServiceBench.StartAsync(Path.Combine(Dir, "service.db"));
        var step = bench.Batch.Steps[1];

        var outcome = LocalBatchModel.Create(bench.Batch).Judge(step, step.TargetReadingG, [], "a-2");

        Assert.True(outcome.WithinWindow);
        Assert.Empty(outcome.RemainingSteps);
        Assert.Equal(step.TargetMassG, outcome.TrueMassG, 9);
    }

    [Fact]
    public void A_batch_naming_a_reagent_the_station_does_not_know_cannot_be_modelled_offline()
    {
        var recipe = DemoScenario.Recipe();
        recipe.Components[2].ReagentId = "site-solvent-7";
        var batch = new Batch { Id = "b-1", Recipe = recipe, Balance = DemoScenario.Balance };

        var ex = Assert.Throws<InvalidInputException>(() => LocalBatchModel.Create(batch));

        Assert.Contains(ex.Errors, e => e.Value == "site-solvent-7");
    }
}
