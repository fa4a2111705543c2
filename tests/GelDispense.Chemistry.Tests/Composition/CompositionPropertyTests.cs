using GelDispense.Chemistry.Reagents;
using FsCheck;
using FsCheck.Xunit;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Tests.Support;

namespace GelDispense.Chemistry.Tests.Composition;

/// <summary>Invariants of the composition maths over random recipes (FsCheck).</summary>
public class CompositionPropertyTests
{
    private static readonly ReagentCatalog Catalog = TestReagents.Catalog();

    private static double Grams(PositiveInt n) => 0.01 * (1 + n.Get % 20000);

    private static Recipe Sol(double teosG, double ethanolG, double waterG, double acidG, double ttipG = 0) => new()
    {
        Name = "random",
        Components =
        [
            new("t-teos", new(teosG, AmountUnit.G)),
            new("t-ttip", new(ttipG, AmountUnit.G)),
            new("t-ethanol", new(ethanolG, AmountUnit.G)),
            new("t-water", new(waterG, AmountUnit.G)),
            new("t-hcl-37", new(acidG, AmountUnit.G)),
        ],
    };

    [Property]
    public bool Mass_is_conserved(PositiveInt a, PositiveInt b, PositiveInt c, PositiveInt d)
    {
        var recipe = Sol(Grams(a), Grams(b), Grams(c), Grams(d));
        var comp = CompositionEvaluator.Evaluate(recipe, Catalog);
        var expected = recipe.Components.Sum(x => x.Amount.Value);
        return Math.Abs(comp.TotalMassG - expected) <= 1e-9 * expected
            && Math.Abs(comp.Components.Sum(x => x.MassG) - expected) <= 1e-9 * expected;
    }

    [Property]
    public bool Ratios_and_densities_do_not_change_with_scale(PositiveInt a, PositiveInt b, PositiveInt c, PositiveInt d, PositiveInt k)
    {
        var recipe = Sol(Grams(a), Grams(b), Grams(c), Grams(d), Grams(k));
        var small = CompositionEvaluator.Evaluate(recipe with { Scale = new(ScaleBasis.GelVolumeMl, 10) }, Catalog);
        var large = CompositionEvaluator.Evaluate(recipe with { Scale = new(ScaleBasis.GelVolumeMl, 10 + k.Get % 5000) }, Catalog);
        return Close(small.HydrolysisRatio, large.HydrolysisRatio)
            && Close(small.OxideDensityGPerMl, large.OxideDensityGPerMl)
            && Close(small.CatalystRatio, large.CatalystRatio)
            && Close(small.SolventRatio, large.SolventRatio)
            && Close(small.Porosity, large.Porosity);
    }

    [Property]
    public bool Porosity_lies_between_zero_and_one(PositiveInt a, PositiveInt b, PositiveInt c, PositiveInt d, PositiveInt e)
    {
        var comp = CompositionEvaluator.Evaluate(Sol(Grams(a), Grams(b) - 0.01, Grams(c) - 0.01, Grams(d) - 0.01, Grams(e) - 0.01), Catalog);
        return comp.Porosity is >= 0 and <= 1;
    }

    [Property]
    public bool R_does_not_depend_on_the_solvent(PositiveInt a, PositiveInt b, PositiveInt c, PositiveInt d, PositiveInt e)
    {
        var one = CompositionEvaluator.Evaluate(Sol(Grams(a), Grams(b), Grams(c), Grams(d)), Catalog);
        var other = CompositionEvaluator.Evaluate(Sol(Grams(a), Grams(e), Grams(c), Grams(d)), Catalog);
        return Close(one.HydrolysisRatio, other.HydrolysisRatio);
    }

    [Property]
    public bool Water_from_a_catalyst_solution_raises_R_by_exactly_its_water(PositiveInt a, PositiveInt b, PositiveInt c, PositiveInt d)
    {
        var acidG = Grams(d);
        var without = CompositionEvaluator.Evaluate(Sol(Grams(a), Grams(b), Grams(c), 0), Catalog);
        var with = CompositionEvaluator.Evaluate(Sol(Grams(a), Grams(b), Grams(c), acidG), Catalog);
        var acidWaterMol = acidG * 0.63 / 18.015; // 37 % HCl is 63 % water by mass
        return Math.Abs(with.HydrolysisRatio - without.HydrolysisRatio - acidWaterMol / with.PrecursorMol) <= 1e-9 * with.HydrolysisRatio;
    }

    private static bool Close(double x, double y) => Math.Abs(x - y) <= 1e-9 * Math.Max(Math.Abs(x), 1e-12);
}
