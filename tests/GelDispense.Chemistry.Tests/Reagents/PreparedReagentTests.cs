using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Reagents;

// See BuiltInReagentsTests for why this is not GelDispense.Chemistry.Tests.Reagents.
namespace GelDispense.Chemistry.Tests.ReagentsTests;

public class PreparedReagentTests
{
    private static readonly Reagent Hcl37 = BuiltInReagents.All.Single(r => r.Id == "hcl-37");
    private static readonly Reagent Teos = BuiltInReagents.All.Single(r => r.Id == "teos");

    [Fact]
    public void Hydrochloric_acid_37_percent_counts_its_water_and_its_HCl_per_gram()
    {
        var hcl = PreparedReagent.Prepare(Hcl37);
        Assert.Equal(0.63 / 18.015, hcl.WaterMolPerG, 1e-12);    // 63 % water, M(H2O) 18.015 (published-values §7)
        Assert.Equal(0.37 / 36.458, hcl.CatalystMolPerG, 1e-12);  // 37 % HCl, M(HCl) 36.458 (§7)
        Assert.Equal(hcl.CatalystMolPerG, hcl.ActiveMolPerG);
        Assert.Equal(0, hcl.PrecursorMolPerG);
        Assert.Equal(0, hcl.SolventMolPerG);
    }

    [Fact]
    public void Zirconium_propoxide_70_percent_counts_precursor_and_propanol_per_gram()
    {
        var zr = PreparedReagent.Prepare(BuiltInReagents.All.Single(r => r.Id == "zr-npropoxide-70"));
        // 0.70 / 327.58 with the published molar mass (§7 V2); the code's 327.574 (Zr 91.222) differs by 2e-5 relative.
        Assert.Equal(0.70 / 327.58, zr.PrecursorMolPerG, 0.70 / 327.58 * 1e-4);
        Assert.Equal(0.30 / 60.096, zr.SolventMolPerG, 1e-9);  // 30 % 1-propanol, M 60.096 (§7)
        Assert.Equal(4 * zr.PrecursorMolPerG, zr.HydrolysableGroupMolPerG, 1e-15);
        Assert.Equal(zr.PrecursorMolPerG * 123.22, zr.OxideGPerG, 1e-5);  // ZrO2 123.22 g per mol (§9 C)
        Assert.Equal(0, zr.WaterMolPerG);
    }

    [Fact]
    public void Teos_releases_four_ethanols_per_molecule_on_full_hydrolysis()
    {
        // Si(OC2H5)4 + 4 H2O → Si(OH)4 + 4 C2H5OH (published-values §9, M: Brinker & Scherer ch. 3).
        var teos = PreparedReagent.Prepare(Teos);
        Assert.Equal(4 / 208.33, teos.AlcoholReleasedMolPerG, 4 / 208.33 * 1e-4);
        Assert.Equal(4 * 46.069 / 208.33, teos.AlcoholReleasedGPerG, 1e-4);
        Assert.Equal(0.2884 / 2.2, teos.OxideSkeletalMlPerG, 1e-4);  // 0.2884 g SiO2 per g at 2.2 g/mL (§7)
    }

    [Theory]
    [InlineData(0)]
    [InlineData(120)]
    [InlineData(-5)]
    [InlineData(double.NaN)]
    public void An_assay_outside_0_to_100_percent_names_the_assay_field(double assayPct)
    {
        var e = Assert.Throws<InvalidInputException>(() =>
            PreparedReagent.Prepare(Hcl37 with { AssayPct = assayPct, Constituents = [] }, "recipe.inlineReagents[0]"));
        // 120 % also makes the mass fractions add up to 1.2, reported as a second error.
        var error = Assert.Single(e.Errors, x => x.Field == "recipe.inlineReagents[0].assayPct");
        Assert.Equal(assayPct.ToString("R", System.Globalization.CultureInfo.InvariantCulture), error.Value);
        Assert.Equal("an assay must be above 0 and at most 100 %", error.Reason);
    }

    [Fact]
    public void Mass_fractions_adding_above_one_name_the_constituents_and_the_sum()
    {
        var e = Assert.Throws<InvalidInputException>(() =>
            PreparedReagent.Prepare(Hcl37 with { AssayPct = 40 }, "recipe.inlineReagents[0]"));  // 0.40 + 0.63 = 1.03
        var error = Assert.Single(e.Errors);
        Assert.Equal("recipe.inlineReagents[0].constituents", error.Field);
        Assert.Equal(1.03, double.Parse(error.Value, System.Globalization.CultureInfo.InvariantCulture), 1e-9);
        Assert.Contains("more than 1", error.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void A_constituent_fraction_outside_0_to_1_names_that_constituent()
    {
        var e = Assert.Throws<InvalidInputException>(() =>
            PreparedReagent.Prepare(Hcl37 with { Constituents = [new("H2O", 1.5, ReagentRole.Water)] }));
        Assert.Equal("reagent.constituents[0].massFraction", Assert.Single(e.Errors).Field);
    }

    [Fact]
    public void A_precursor_without_precursor_data_names_the_precursor_field()
    {
        var e = Assert.Throws<InvalidInputException>(() => PreparedReagent.Prepare(Teos with { Precursor = null }));
        var error = Assert.Single(e.Errors);
        Assert.Equal("reagent.precursor", error.Field);
        Assert.Contains("oxide formula", error.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void A_bad_formula_names_the_formula_field_and_the_position()
    {
        var e = Assert.Throws<InvalidInputException>(() => PreparedReagent.Prepare(Teos with { Formula = "Si(OEt)4" }));
        var error = Assert.Single(e.Errors);
        Assert.Equal("reagent.formula", error.Field);
        Assert.Equal("unknown element 'Et' at position 5", error.Reason);
    }

    [Fact]
    public void A_bad_oxide_formula_and_skeletal_density_are_both_reported_at_once()
    {
        var broken = Teos with { Precursor = new PrecursorData("SiO", 1, 4, 0, "C2H5OH") with { OxideFormula = "sio2" } };
        var e = Assert.Throws<InvalidInputException>(() => PreparedReagent.Prepare(broken));
        Assert.Equal(
            ["reagent.precursor.oxideFormula", "reagent.precursor.oxideSkeletalDensityGPerMl"],
            e.Errors.Select(x => x.Field).Order(StringComparer.Ordinal));
    }

    [Fact]
    public void A_density_that_turns_negative_inside_its_range_is_refused()
    {
        // 0.9 g/mL at 20 °C falling 0.05 g/mL per K reaches −0.1 g/mL at 40 °C.
        var e = Assert.Throws<InvalidInputException>(() => PreparedReagent.Prepare(Teos with { Density = new LinearDensity(0.9, 20, -0.05) }));
        Assert.Equal("reagent.densityGPerMl", Assert.Single(e.Errors).Field);
    }
}
