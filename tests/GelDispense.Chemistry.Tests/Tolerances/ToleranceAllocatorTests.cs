using FsCheck;
using FsCheck.Xunit;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Metrology;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Tests.Support;
using GelDispense.Chemistry.Tolerances;

namespace GelDispense.Chemistry.Tests.Tolerances;

public class ToleranceAllocatorTests
{
    private static (Recipe Recipe, BalanceProfile Balance) RandomCase(int seed)
    {
        var random = new Random(seed);
        var recipe = PlanFixtures.SilicaSol(
            gelVolumeMl: 10 + random.NextDouble() * 490,
            acidRatio: 0.001 + random.NextDouble() * 0.05,
            rTolerancePct: 0.5 + random.NextDouble() * 4.5,
            densityTolerancePct: 1 + random.NextDouble() * 4);
        var d = new[] { 0.0001, 0.001, 0.01 }[random.Next(3)];
        return (recipe, new BalanceProfile(d, 5000, d * (1 + 2 * random.NextDouble())));
    }

    /// <summary>
    /// The guarantee itself, checked without the allocator's own machinery: every one of the 2^n corners of
    /// the windows is evaluated with the composition evaluator, and R and the oxide density must stay in spec.
    /// </summary>
    [Property(MaxTest = 60)]
    public bool Every_corner_of_the_windows_keeps_R_and_density_in_spec(int seed)
    {
        var (recipe, balance) = RandomCase(seed);
        var plan = PlanFixtures.Plan(recipe, balance);
        var f = plan.Formulation;
        var n = f.Lines.Count;
        for (var corner = 0; corner < 1 << n; corner++)
        {
            var masses = new double[n];
            foreach (var s in plan.Steps)
            {
                masses[s.ComponentIndex] = s.TargetMassG + ((corner >> s.Index & 1) == 1 ? s.ToleranceG : -s.ToleranceG);
            }

            var c = CompositionEvaluator.Describe(f.WithMasses(masses));
            if (!recipe.Spec!.HydrolysisRatio!.Accepts(c.HydrolysisRatio) || !recipe.Spec.OxideDensityGPerMl!.Accepts(c.OxideDensityGPerMl))
            {
                return false;
            }
        }

        return true;
    }

    [Property(MaxTest = 40)]
    public bool No_window_below_its_cap_can_grow_without_breaking_the_spec(int seed)
    {
        var (recipe, balance) = RandomCase(seed);
        var plan = PlanFixtures.Plan(recipe, balance);
        var f = plan.Formulation;
        var quantities = SpecQuantities.For(f, recipe.Spec);
        var masses = f.MassesG.ToArray();
        var windows = new double[masses.Length];
        foreach (var s in plan.Steps)
        {
            windows[s.ComponentIndex] = s.ToleranceG;
        }

        foreach (var s in plan.Steps.Where(s => s.ToleranceG < 0.02 * s.TargetMassG * 0.999))
        {
            var wider = (double[])windows.Clone();
            wider[s.ComponentIndex] *= 1.01;
            if (ToleranceAllocator.Holds(quantities, masses, wider, ToleranceMode.WorstCase))
            {
                return false;
            }
        }

        return true;
    }

    [Fact]
    public void A_step_the_spec_does_not_bind_gets_the_default_two_percent_cap()
    {
        // With only R in the spec, ethanol changes neither water nor precursor moles.
        var recipe = PlanFixtures.SilicaSol() with { Spec = new FormulationSpec { HydrolysisRatio = new SpecTarget(4, 1) } };
        var plan = PlanFixtures.Plan(recipe with { Components = [.. recipe.Components.Select(c => c.ReagentId == "t-ethanol" ? c with { Amount = new(6, AmountUnit.Ratio) } : c)] }, PlanFixtures.Analytical);
        var ethanol = plan.Steps.Single(s => s.ReagentId == "t-ethanol");
        Assert.Equal(0.02 * ethanol.TargetMassG, ethanol.ToleranceG, 12);
    }

    [Fact]
    public void A_per_component_limit_overrides_the_default()
    {
        var recipe = PlanFixtures.SilicaSol() with { Spec = new FormulationSpec { HydrolysisRatio = new SpecTarget(4, 1) } };
        var recipeAsMol = recipe with { Components = [.. recipe.Components.Select(c => c.ReagentId == "t-ethanol" ? c with { Amount = new(6, AmountUnit.Ratio) } : c)] };
        var options = new PlanOptions { StepLimitPctByReagent = new Dictionary<string, double> { ["t-ethanol"] = 0.5 } };
        var ethanol = PlanFixtures.Plan(recipeAsMol, PlanFixtures.Analytical, options: options).Steps.Single(s => s.ReagentId == "t-ethanol");
        Assert.Equal(0.005 * ethanol.TargetMassG, ethanol.ToleranceG, 12);
    }

    [Fact]
    public void Steps_bound_by_the_same_quantity_get_windows_in_proportion_to_their_device_error()
    {
        // An OIML class II balance: its mpe grows with the gross load (R 76 Table 6), so later steps weigh with a
        // larger error and must be given proportionally more room.
        var balance = new BalanceProfile(0.001, 220, AccuracyClass: AccuracyClass.II, VerificationIntervalG: 0.01);
        var recipe = PlanFixtures.SilicaSol(gelVolumeMl: 60) with { Spec = new FormulationSpec { HydrolysisRatio = new SpecTarget(4, 0.5) } };
        var plan = PlanFixtures.Plan(recipe, balance);
        var free = plan.Steps.Where(s => s.ToleranceG < 0.02 * s.TargetMassG * 0.999).ToArray();
        Assert.True(free.Length >= 2);
        Assert.True(free.Select(s => s.DeviceErrorG).Distinct().Count() >= 2, "the class II mpe differs between loads");
        var ratios = free.Select(s => s.ToleranceG / s.DeviceErrorG).ToArray();
        Assert.All(ratios, r => Assert.Equal(ratios[0], r, 6));
    }

    [Fact]
    public void Root_sum_square_windows_are_wider_than_worst_case()
    {
        var recipe = PlanFixtures.SilicaSol(rTolerancePct: 0.5, densityTolerancePct: 0.5);
        var worst = PlanFixtures.Plan(recipe, PlanFixtures.Analytical);
        var rss = PlanFixtures.Plan(recipe, PlanFixtures.Analytical, options: new PlanOptions { Mode = ToleranceMode.RootSumSquare });
        Assert.True(rss.Steps.Sum(s => s.ToleranceG) > worst.Steps.Sum(s => s.ToleranceG));
        Assert.All(worst.SpecChecks, c => Assert.True(c.Guaranteed));
    }
}
