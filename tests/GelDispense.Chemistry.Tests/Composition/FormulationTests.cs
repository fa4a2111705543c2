using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Reagents;
using GelDispense.Chemistry.Tests.Support;

namespace GelDispense.Chemistry.Tests.Composition;

public class FormulationTests
{
    private static readonly ReagentCatalog Catalog = TestReagents.Catalog();

    private static InputError SingleError(Recipe recipe) =>
        Assert.Single(Assert.Throws<InvalidInputException>(() => Formulation.Prepare(recipe, Catalog)).Errors);

    private static Recipe With(params RecipeComponent[] components) => new() { Name = "x", Components = components };

    [Theory]
    [InlineData(-1.0, "cannot be negative")]
    [InlineData(double.NaN, "finite")]
    [InlineData(double.PositiveInfinity, "finite")]
    [InlineData(1e12, "plausible")]
    public void A_bad_amount_is_refused_naming_the_field(double value, string reason)
    {
        var error = SingleError(With(new("t-teos", new(1, AmountUnit.G)), new("t-ethanol", new(value, AmountUnit.G))));
        Assert.Equal("recipe.components[1].amount.value", error.Field);
        Assert.Contains(reason, error.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void An_unknown_reagent_is_refused_naming_the_component()
    {
        var error = SingleError(With(new("t-teos", new(1, AmountUnit.G)), new("unobtainium", new(1, AmountUnit.G))));
        Assert.Equal("recipe.components[1].reagentId", error.Field);
        Assert.Equal("unobtainium", error.Value);
    }

    [Fact]
    public void An_unknown_unit_is_refused()
    {
        var error = SingleError(With(new RecipeComponent("t-teos", new(1, (AmountUnit)42))));
        Assert.Equal("recipe.components[0].amount.unit", error.Field);
    }

    [Fact]
    public void Ratios_without_a_scale_or_an_absolute_precursor_are_refused()
    {
        var error = SingleError(With(new("t-teos", new(1, AmountUnit.Ratio)), new("t-water", new(4, AmountUnit.Ratio))));
        Assert.Equal("recipe.scale", error.Field);
    }

    [Fact]
    public void Ratios_are_taken_per_mole_of_an_absolute_precursor()
    {
        var f = Formulation.Prepare(With(new("t-teos", new(0.2, AmountUnit.Mol)), new("t-water", new(4, AmountUnit.Ratio))), Catalog);
        Assert.Equal(0.8, f.Totals().WaterMol, 12);
    }

    [Fact]
    public void A_recipe_without_precursor_is_refused()
    {
        var error = SingleError(With(new("t-ethanol", new(1, AmountUnit.G)), new("t-water", new(1, AmountUnit.G))));
        Assert.Equal("recipe.components", error.Field);
        Assert.Contains("no precursor", error.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void An_empty_recipe_is_refused()
    {
        Assert.Equal("recipe.components", SingleError(With()).Field);
    }

    [Fact]
    public void A_temperature_outside_the_density_data_is_refused()
    {
        var error = SingleError(With(new RecipeComponent("t-teos", new(1, AmountUnit.G))) with { TemperatureC = 65 });
        Assert.Equal("recipe.temperatureC", error.Field);
        Assert.Contains("'t-teos'", error.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void An_inline_reagent_whose_mass_fractions_exceed_one_is_refused()
    {
        var bad = TestReagents.Hcl37 with { Id = "acid-x", AssayPct = 50, Constituents = [new("H2O", 0.6, ReagentRole.Water)] };
        var recipe = With(new("t-teos", new(1, AmountUnit.G)), new("acid-x", new(1, AmountUnit.G))) with { InlineReagents = [bad] };
        var errors = Assert.Throws<InvalidInputException>(() => Formulation.Prepare(recipe, Catalog)).Errors;
        Assert.Contains(errors, e => e.Field == "recipe.inlineReagents[0].constituents" && e.Reason.Contains("more than 1", StringComparison.Ordinal));
    }

    [Fact]
    public void Every_problem_is_reported_at_once()
    {
        var recipe = With(new("t-teos", new(-1, AmountUnit.G)), new("nothing", new(1, AmountUnit.G)), new("t-water", new(1, AmountUnit.G), 0));
        var errors = Assert.Throws<InvalidInputException>(() => Formulation.Prepare(recipe, Catalog)).Errors;
        Assert.Equal(3, errors.Count);
    }

    [Fact]
    public void An_inline_reagent_overrides_the_catalog_for_that_recipe_only()
    {
        var heavy = TestReagents.Ethanol with { Density = new LinearDensity(1.0, 20, 0) };
        var recipe = With(new("t-teos", new(1, AmountUnit.G)), new("t-ethanol", new(10, AmountUnit.ML))) with { InlineReagents = [heavy] };
        Assert.Equal(10.0, Formulation.Prepare(recipe, Catalog).MassesG[1], 12);
        Assert.Equal(7.893, Formulation.Prepare(recipe with { InlineReagents = [] }, Catalog).MassesG[1], 12);
    }
}
