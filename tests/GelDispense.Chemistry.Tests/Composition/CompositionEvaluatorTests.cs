using GelDispense.Chemistry.Reagents;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Tests.Support;

namespace GelDispense.Chemistry.Tests.Composition;

public class CompositionEvaluatorTests
{
    private static readonly ReagentCatalog Catalog = TestReagents.Catalog();

    /// <summary>
    /// A worked example computed by hand, every intermediate written out. Atomic weights: IUPAC 2021
    /// conventional values (H 1.008, C 12.011, O 15.999, Si 28.085, Cl 35.45); water density: Tanaka 2001 at
    /// 20 °C, 998.2067 kg/m³ (published-values §5, V); oxide yield 1 SiO2 per TEOS (published-values §9).
    /// </summary>
    [Fact]
    public void Teos_ethanol_water_and_hydrochloric_acid_evaluate_to_the_hand_computed_composition()
    {
        var recipe = new Recipe
        {
            Name = "hand check",
            TemperatureC = 20,
            Components =
            [
                new("t-teos", new(0.1, AmountUnit.Mol)),
                new("t-ethanol", new(0.4, AmountUnit.Mol)),
                new("t-water", new(0.4, AmountUnit.Mol)),
                new("t-hcl-37", new(100, AmountUnit.Mg)),
            ],
        };

        // Molar masses from the formulas.
        const double mTeos = 28.085 + 4 * (2 * 12.011 + 5 * 1.008 + 15.999);   // 208.329 g/mol
        const double mEthanol = 2 * 12.011 + 6 * 1.008 + 15.999;                 // 46.069 g/mol
        const double mWater = 2 * 1.008 + 15.999;                                // 18.015 g/mol
        const double mHcl = 1.008 + 35.45;                                       // 36.458 g/mol
        const double mSio2 = 28.085 + 2 * 15.999;                                // 60.083 g/mol

        // Masses and volumes at 20 °C.
        const double teosG = 0.1 * mTeos, teosMl = teosG / 0.933;               // 20.8329 g, 22.3289 mL
        const double ethanolG = 0.4 * mEthanol, ethanolMl = ethanolG / 0.7893;  // 18.4276 g, 23.3468 mL
        const double waterG = 0.4 * mWater, waterMl = waterG / 0.9982067;       // 7.2060 g, 7.2189 mL
        const double acidG = 0.100, acidMl = acidG / 1.184;                     // 0.1000 g, 0.08446 mL

        // Water counts from both the water and the 63 % water part of the acid.
        const double acidWaterMol = acidG * 0.63 / mWater;                      // 0.0034971 mol
        const double acidHclMol = acidG * 0.37 / mHcl;                          // 0.0010149 mol
        const double waterMol = 0.4 + acidWaterMol;                             // 0.4034971 mol
        const double r = waterMol / 0.1;                                        // 4.034971

        const double gelMl = teosMl + ethanolMl + waterMl + acidMl;             // 52.979 mL
        const double oxideG = 0.1 * mSio2;                                      // 6.0083 g
        const double oxideDensity = oxideG / gelMl;                             // 0.11341 g/mL
        const double solids = oxideG / 2.2 / gelMl;                             // 0.05155

        var c = CompositionEvaluator.Evaluate(recipe, Catalog);

        Assert.Equal(teosG, c.Components[0].MassG, 9);
        Assert.Equal(ethanolG, c.Components[1].MassG, 9);
        Assert.Equal(waterG, c.Components[2].MassG, 9);
        Assert.Equal(acidHclMol, c.Components[3].Moles, 12);
        Assert.Equal(gelMl, c.GelVolumeMl, 6);
        Assert.Equal(oxideG, c.OxideMassG, 9);
        Assert.Equal(oxideDensity, c.OxideDensityGPerMl, 7); // water density rounded to 7 figures above
        Assert.Equal(solids, c.SolidsVolumeFraction, 8);
        Assert.Equal(1 - solids, c.Porosity, 8);
        Assert.Equal(waterMol, c.WaterMol, 12);
        Assert.Equal(r, c.HydrolysisRatio, 9);
        Assert.Equal(waterMol / 0.4, c.WaterPerHydrolysableGroup, 9);
        Assert.Equal(HydrolysisRegime.FullHydrolysis, c.Regime);
        Assert.Equal(4.0, c.SolventRatio, 9);
        Assert.Equal(acidHclMol / 0.1, c.CatalystRatio, 12);
        Assert.Equal(acidHclMol / (gelMl / 1000), c.CatalystMolarityMolPerL, 8);
        Assert.Equal(0.4, c.AlcoholReleasedMol, 12);                            // 4 ethoxy groups per TEOS
        Assert.Equal(0.4 * mEthanol, c.AlcoholReleasedG, 9);
        Assert.Contains(c.Warnings, w => w.Contains("'t-hcl-37' adds 0.035", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData(1.5, HydrolysisRegime.BelowStoichiometric)]
    [InlineData(2.0, HydrolysisRegime.RelyingOnCondensationWater)]
    [InlineData(3.99, HydrolysisRegime.RelyingOnCondensationWater)]
    [InlineData(4.0, HydrolysisRegime.FullHydrolysis)]
    public void Regime_of_a_tetra_alkoxide_follows_g_over_2_and_g(double r, HydrolysisRegime expected)
    {
        // Si(OR)4 + 2 H2O → SiO2 + 4 ROH (net, R = 2) and full hydrolysis at R = 4: published-values §9.
        var c = CompositionEvaluator.Evaluate(Ratios(("t-teos", 1), ("t-ethanol", 4), ("t-water", r)), Catalog);
        Assert.Equal(expected, c.Regime);
    }

    [Fact]
    public void A_trialkoxysilane_reaches_full_conversion_at_R_one_and_a_half()
    {
        // CH3Si(OR)3 has g = 3 groups, so g/2 = 1.5: design §2.
        var below = CompositionEvaluator.Evaluate(Ratios(("t-mtms", 1), ("t-water", 1.49)), Catalog);
        var at = CompositionEvaluator.Evaluate(Ratios(("t-mtms", 1), ("t-water", 1.5)), Catalog);
        Assert.Equal(HydrolysisRegime.BelowStoichiometric, below.Regime);
        Assert.Equal(HydrolysisRegime.RelyingOnCondensationWater, at.Regime);
    }

    [Fact]
    public void Mixed_oxide_reports_metal_and_oxide_fractions()
    {
        // 0.8 TEOS + 0.2 TTIP: metal fractions 0.8/0.2; oxide masses 0.8·60.083 and 0.2·79.865 g per mol.
        var c = CompositionEvaluator.Evaluate(Ratios(("t-teos", 0.8), ("t-ttip", 0.2), ("t-2-propanol", 5), ("t-water", 4)), Catalog);
        var si = c.Oxides.Single(o => o.ReagentId == "t-teos");
        var ti = c.Oxides.Single(o => o.ReagentId == "t-ttip");
        Assert.Equal(0.8, si.MetalMolFraction, 12);
        Assert.Equal(0.2, ti.MetalMolFraction, 12);
        var siMass = 0.8 * 60.083;
        var tiMass = 0.2 * (47.867 + 2 * 15.999);
        Assert.Equal(siMass / (siMass + tiMass), si.OxideMassFraction, 9);
    }

    [Fact]
    public void Stages_report_cumulative_R()
    {
        // Two-step sol: 1 water per precursor with acid first, then 3 more with the second stage.
        var recipe = new Recipe
        {
            Name = "two-step",
            Scale = new BatchScale(ScaleBasis.PrecursorMol, 0.05),
            Components =
            [
                new("t-teos", new(1, AmountUnit.Ratio), 1),
                new("t-ethanol", new(3, AmountUnit.Ratio), 1),
                new("t-water", new(1, AmountUnit.Ratio), 1),
                new("t-water", new(3, AmountUnit.Ratio), 2),
            ],
        };
        var c = CompositionEvaluator.Evaluate(recipe, Catalog);
        Assert.Equal(2, c.Stages.Count);
        Assert.Equal(1.0, c.Stages[0].HydrolysisRatio, 9);
        Assert.Equal(4.0, c.Stages[1].HydrolysisRatio, 9);
        Assert.Equal(0.05, c.PrecursorMol, 12);
    }

    [Fact]
    public void Dried_density_follows_the_cube_of_linear_shrinkage()
    {
        // ρ = ρ0/(1 − s)³; s = 0.10 gives ρ/ρ0 = 1.372 (published-values §9, definition).
        Assert.Equal(1.3717, CompositionEvaluator.DriedDensityGPerMl(1.0, 0.10), 4);
        var recipe = Ratios(("t-teos", 1), ("t-ethanol", 4), ("t-water", 4)) with { LinearShrinkage = 0.1 };
        var c = CompositionEvaluator.Evaluate(recipe, Catalog);
        Assert.Equal(c.OxideDensityGPerMl / 0.729, c.DriedDensityGPerMl!.Value, 9);
    }

    [Theory]
    [InlineData(ScaleBasis.GelVolumeMl, 250.0)]
    [InlineData(ScaleBasis.PrecursorMol, 0.3)]
    [InlineData(ScaleBasis.OxideMassG, 12.0)]
    public void A_scale_fixes_the_named_quantity(ScaleBasis basis, double value)
    {
        var recipe = Ratios(("t-teos", 1), ("t-ethanol", 4), ("t-water", 4)) with { Scale = new BatchScale(basis, value) };
        var c = CompositionEvaluator.Evaluate(recipe, Catalog);
        var actual = basis switch
        {
            ScaleBasis.GelVolumeMl => c.GelVolumeMl,
            ScaleBasis.PrecursorMol => c.PrecursorMol,
            _ => c.OxideMassG,
        };
        Assert.Equal(value, actual, 9);
    }

    [Fact]
    public void Volumes_are_taken_at_the_recipe_temperature()
    {
        // 10 mL of ethanol weighs 10 × (0.7893 − 0.00086 × 5) g at 25 °C (ethanol table, published-values §7, V).
        var recipe = new Recipe
        {
            Name = "volume", TemperatureC = 25,
            Components = [new("t-teos", new(1, AmountUnit.G)), new("t-ethanol", new(10, AmountUnit.ML))],
        };
        var c = CompositionEvaluator.Evaluate(recipe, Catalog);
        Assert.Equal(10 * (0.7893 - 0.00086 * 5), c.Components[1].MassG, 9);
    }

    internal static Recipe Ratios(params (string Id, double Ratio)[] parts) => new()
    {
        Name = "ratios",
        Scale = new BatchScale(ScaleBasis.PrecursorMol, 1),
        Components = [.. parts.Select(p => new RecipeComponent(p.Id, new Amount(p.Ratio, AmountUnit.Ratio)))],
    };
}
