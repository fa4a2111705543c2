using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Metrology;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Replanning;
using GelDispense.Chemistry.Tests.Support;

namespace GelDispense.Chemistry.Tests.Replanning;

public class ReplannerTests
{
    private static readonly PlanRequest Station = new(PlanFixtures.Analytical, null, AirConditions.Standard);

    /// <summary>TEOS, water, ethanol, acid: water goes in before the free solvent, so the solvent can absorb a water error.</summary>
    private static Recipe WaterBeforeEthanol()
    {
        var sol = PlanFixtures.SilicaSol();
        return sol with { Components = [sol.Components[0], sol.Components[2], sol.Components[1], sol.Components[3]] };
    }

    private static DispensingPlan Plan(Recipe recipe, PlanRequest? request = null) =>
        PlanBuilder.Build(recipe, PlanFixtures.Catalog, request ?? Station);

    [Fact]
    public void An_over_pour_of_the_first_precursor_is_restored_exactly_by_scaling_the_rest()
    {
        var plan = Plan(PlanFixtures.SilicaSol());
        var teos = plan.Steps[0];
        var result = Replanner.Replan(plan, [new RecordedAddition(0, teos.TargetMassG * 1.10)], Station);

        Assert.True(result.InsideSpec);
        Assert.Equal(4.0, result.PredictedHydrolysisRatio, 9);
        Assert.Equal(0.08, result.PredictedOxideDensityGPerMl, 9);
        Assert.Equal(1.10, result.ScaleFactor, 6);
        foreach (var step in result.Plan.Steps.Skip(1))
        {
            Assert.False(step.Done);
            Assert.Equal(plan.Steps[step.Index].TargetMassG * 1.10, step.TargetMassG, 6);
        }

        Assert.True(result.Plan.Steps[0].Done);
        Assert.Equal(teos.TargetMassG * 1.10, result.Plan.Steps[0].TargetMassG, 12);
    }

    [Fact]
    public void A_water_over_pour_mid_batch_restores_the_density_and_flags_R_that_cannot_be_restored()
    {
        var plan = Plan(WaterBeforeEthanol());
        var done = new[] { new RecordedAddition(0, plan.Steps[0].TargetMassG), new RecordedAddition(1, plan.Steps[1].TargetMassG * 1.03) };
        var result = Replanner.Replan(plan, done, Station);

        Assert.False(result.InsideSpec);
        Assert.Equal(0.08, result.PredictedOxideDensityGPerMl, 6);
        Assert.Equal(4.0 * 1.03, result.PredictedHydrolysisRatio, 2);
        Assert.True(result.Plan.Steps[2].TargetMassG < plan.Steps[2].TargetMassG, "less ethanol makes room for the extra water");
        Assert.Contains(result.Warnings, w => w.Contains("hydrolysisRatio", StringComparison.Ordinal));
    }

    [Fact]
    public void With_top_ups_allowed_a_water_over_pour_is_restored_by_more_precursor()
    {
        var plan = Plan(WaterBeforeEthanol());
        var done = new[] { new RecordedAddition(0, plan.Steps[0].TargetMassG), new RecordedAddition(1, plan.Steps[1].TargetMassG * 1.03) };
        var result = Replanner.Replan(plan, done, Station, new ReplanOptions { AllowTopUps = true });

        Assert.True(result.InsideSpec);
        Assert.Equal(4.0, result.PredictedHydrolysisRatio, 6);
        Assert.Equal(0.08, result.PredictedOxideDensityGPerMl, 6);
        var topUp = Assert.Single(result.TopUps);
        Assert.Equal("t-teos", topUp.ReagentId);
        Assert.Equal(plan.Steps[0].TargetMassG * 0.03, topUp.ExtraMassG, 4);
    }

    [Fact]
    public void An_over_pour_the_vessel_cannot_absorb_gives_the_nearest_composition_that_fits_and_says_so()
    {
        var capacityMl = 105.0;
        var request = Station with { Options = new PlanOptions { VesselCapacityMl = capacityMl } };
        var plan = Plan(PlanFixtures.SilicaSol(), request);
        var result = Replanner.Replan(plan, [new RecordedAddition(0, plan.Steps[0].TargetMassG * 1.25)], request);

        Assert.True(result.CapacityLimited);
        Assert.False(result.InsideSpec);
        Assert.True(result.PredictedGelVolumeMl <= capacityMl * (1 + 1e-6));
        Assert.Contains(result.Warnings, w => w.Contains("capacity", StringComparison.Ordinal));
    }

    [Fact]
    public void Recorded_masses_are_kept_and_never_reduced()
    {
        var plan = Plan(PlanFixtures.SilicaSol());
        var done = new[] { new RecordedAddition(0, plan.Steps[0].TargetMassG * 0.97), new RecordedAddition(1, plan.Steps[1].TargetMassG * 1.05) };
        var result = Replanner.Replan(plan, done, Station);
        Assert.Equal(done[0].TrueMassG, result.Plan.Steps[0].TargetMassG, 12);
        Assert.Equal(done[1].TrueMassG, result.Plan.Steps[1].TargetMassG, 12);
        Assert.All(result.Plan.Steps.Skip(2), s => Assert.True(s.TargetMassG >= 0));
    }

    [Fact]
    public void A_recorded_addition_for_an_unknown_step_is_refused()
    {
        var plan = Plan(PlanFixtures.SilicaSol());
        var error = Assert.Throws<Errors.InvalidInputException>(() => Replanner.Replan(plan, [new RecordedAddition(9, 1)], Station));
        Assert.Equal("stepIndex", error.Errors[0].Field);
    }
}
