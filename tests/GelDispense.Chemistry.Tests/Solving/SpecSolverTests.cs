using GelDispense.Chemistry.Reagents;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Solving;
using GelDispense.Chemistry.Tests.Support;

namespace GelDispense.Chemistry.Tests.Solving;

public class SpecSolverTests
{
    private static readonly ReagentCatalog Catalog = TestReagents.Catalog();

    private static Recipe Aerogel(double density, double? r = null, double gelVolumeMl = 100) => new()
    {
        Name = "solver",
        Scale = new BatchScale(ScaleBasis.GelVolumeMl, gelVolumeMl),
        Components =
        [
            new("t-teos", new(1, AmountUnit.Ratio)),
            new("t-ethanol", new(1, AmountUnit.Ratio)),
            new("t-water", new(4, AmountUnit.Ratio)),
            new("t-hcl-37", new(0.01, AmountUnit.Ratio)),
        ],
        Spec = new FormulationSpec
        {
            OxideDensityGPerMl = new SpecTarget(density, 2),
            HydrolysisRatio = r is null ? null : new SpecTarget(r.Value, 1),
        },
    };

    [Fact]
    public void The_free_solvent_is_solved_to_the_target_density_at_the_batch_volume()
    {
        var solved = SpecSolver.Solve(Aerogel(0.10), Catalog);
        Assert.Equal(0.10, solved.Composition.OxideDensityGPerMl, 10);
        Assert.Equal(100, solved.Composition.GelVolumeMl, 9);
        Assert.All(solved.Recipe.Components, c => Assert.Equal(AmountUnit.G, c.Amount.Unit));
    }

    [Fact]
    public void R_counts_the_water_of_the_acid_and_the_pure_water_is_reduced_to_match()
    {
        var solved = SpecSolver.Solve(Aerogel(0.08, r: 4.0), Catalog);
        Assert.Equal(4.0, solved.Composition.HydrolysisRatio, 10);
        Assert.Equal(0.08, solved.Composition.OxideDensityGPerMl, 10);
        Assert.True(solved.WaterFactor < 1, "the acid's water replaces some pure water");
    }

    [Fact]
    public void An_unreachable_density_names_the_highest_reachable_one()
    {
        var error = Assert.Single(Assert.Throws<InvalidInputException>(() => SpecSolver.Solve(Aerogel(0.5), Catalog)).Errors);
        Assert.Equal("recipe.spec.oxideDensityGPerMl.value", error.Field);
        Assert.Contains("highest reachable oxide density is 0.2", error.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void The_highest_reachable_density_is_reachable_exactly()
    {
        // TEOS + water (R 4) + acid with no ethanol: the limit stated by the error must itself solve, to zero ethanol.
        var message = Assert.Throws<InvalidInputException>(() => SpecSolver.Solve(Aerogel(0.5), Catalog)).Errors[0].Reason;
        var highest = double.Parse(message[(message.LastIndexOf("is ", StringComparison.Ordinal) + 3)..].Split(' ')[0], System.Globalization.CultureInfo.InvariantCulture);
        var solved = SpecSolver.Solve(Aerogel(highest * 0.999), Catalog);
        Assert.True(solved.Formulation.MassesG[1] >= 0);
    }

    [Fact]
    public void Several_solvents_need_the_free_one_named()
    {
        var recipe = Aerogel(0.1) with
        {
            Components = [.. Aerogel(0.1).Components, new RecipeComponent("t-2-propanol", new(1, AmountUnit.Ratio))],
        };
        var error = Assert.Throws<InvalidInputException>(() => SpecSolver.Solve(recipe, Catalog)).Errors[0];
        Assert.Equal("recipe.spec.freeSolventIds", error.Field);

        var named = recipe with { Spec = recipe.Spec! with { FreeSolventIds = ["t-ethanol", "t-2-propanol"] } };
        var solved = SpecSolver.Solve(named, Catalog);
        Assert.Equal(0.1, solved.Composition.OxideDensityGPerMl, 10);
        // The group keeps its written proportion, 1 mol : 1 mol.
        Assert.Equal(solved.Composition.Components[1].Moles, solved.Composition.Components[4].Moles, 10);
    }

    [Fact]
    public void A_spec_without_density_is_refused()
    {
        var recipe = Aerogel(0.1) with { Spec = new FormulationSpec() };
        Assert.Equal("recipe.spec.oxideDensityGPerMl", Assert.Throws<InvalidInputException>(() => SpecSolver.Solve(recipe, Catalog)).Errors[0].Field);
    }
}
