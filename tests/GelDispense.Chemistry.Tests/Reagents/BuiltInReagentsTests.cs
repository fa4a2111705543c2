using GelDispense.Chemistry.Reagents;

// Not GelDispense.Chemistry.Tests.Reagents: that namespace would capture the qualified name ReagentCatalog
// used by the Composition and Solving tests.
namespace GelDispense.Chemistry.Tests.ReagentsTests;

public class BuiltInReagentsTests
{
    private static readonly ReagentCatalog Catalog = BuiltInReagents.CreateCatalog();

    [Fact]
    public void The_catalog_holds_every_required_reagent_under_its_id()
    {
        string[] required =
        [
            "teos", "tmos", "mtms", "mtes", "ttip", "tbot", "zr-npropoxide-70", "al-sbutoxide", "ethanol", "methanol",
            "1-propanol", "2-propanol", "acetone", "water", "hcl-37", "hcl-0.1m", "hno3-68", "nh3-28", "nh3-1m", "nh4f",
            "acac", "formamide",
        ];
        Assert.Equal(required.Order(StringComparer.Ordinal), BuiltInReagents.All.Select(r => r.Id).Order(StringComparer.Ordinal));
        Assert.All(required, id => Assert.NotNull(Catalog.Find(id)));
        Assert.NotNull(Catalog.Find("TEOS"));  // ids compare without regard to case
    }

    [Fact]
    public void Every_reagent_prepares_and_names_its_sources()
    {
        foreach (var reagent in BuiltInReagents.All)
        {
            var prepared = PreparedReagent.Prepare(reagent, $"catalog.{reagent.Id}");
            Assert.True(prepared.ActiveMolPerG > 0, reagent.Id);
            Assert.False(string.IsNullOrWhiteSpace(reagent.Source), reagent.Id);
            Assert.False(string.IsNullOrWhiteSpace(reagent.Name), reagent.Id);
        }
    }

    [Fact]
    public void Every_classified_reagent_carries_known_GHS_codes_and_only_water_is_unclassified()
    {
        foreach (var reagent in BuiltInReagents.All)
        {
            Assert.All(reagent.GhsHazards, code => Assert.True(GhsStatements.TryGetStatement(code, out _), $"{reagent.Id}: {code}"));
            Assert.Equal(reagent.Id != "water", reagent.GhsHazards.Count > 0);
        }
    }

    [Fact]
    public void Solutions_account_for_their_whole_mass()
    {
        foreach (var reagent in BuiltInReagents.All.Where(r => r.Constituents.Count > 0))
        {
            Assert.Equal(1.0, (reagent.AssayPct / 100) + reagent.Constituents.Sum(c => c.MassFraction), 1e-12);
        }
    }

    [Fact]
    public void Exactly_the_precursors_carry_precursor_data_and_every_density_covers_10_to_40_C()
    {
        foreach (var reagent in BuiltInReagents.All)
        {
            Assert.Equal(reagent.Role == ReagentRole.Precursor, reagent.Precursor is not null);
            Assert.True(reagent.Density.Covers(10) && reagent.Density.Covers(40), reagent.Id);
        }
    }

    [Theory]
    [InlineData("ethanol", 20, 0.7893, 0.00005)]      // published-values §7 V
    [InlineData("ethanol", 25, 0.7850, 0.00005)]      // §7 V, through the −0.00086 g/mL/K coefficient (§7 V)
    [InlineData("ethanol", 10, 0.7978, 0.00015)]      // §7 V ethanol table; the linear coefficient is good to ~1e-4
    [InlineData("ethanol", 30, 0.7807, 0.00015)]      // §7 V ethanol table
    [InlineData("teos", 20, 0.933, 0.0005)]           // §7 V
    [InlineData("tmos", 25, 1.032, 0.0005)]           // §7 V
    [InlineData("mtms", 25, 0.955, 0.0005)]           // §7 V
    [InlineData("mtes", 25, 0.895, 0.0005)]           // §7 M (from memory)
    [InlineData("ttip", 20, 0.96, 0.005)]             // §7 V
    [InlineData("tbot", 25, 0.998, 0.0005)]           // §7 V
    [InlineData("tbot", 20, 1.00, 0.005)]             // §7 V "~1.00 at 20 °C", through the estimated coefficient
    [InlineData("zr-npropoxide-70", 25, 1.044, 0.0005)] // §7 V2 (vendor-data compilation)
    [InlineData("al-sbutoxide", 25, 0.96, 0.005)]     // §7 M (from memory)
    [InlineData("methanol", 25, 0.7866, 0.00005)]     // §7 V
    [InlineData("methanol", 20, 0.7914, 0.00005)]     // §7 CRC value, M/V2
    [InlineData("1-propanol", 20, 0.8035, 0.00005)]   // §7 M (from memory)
    [InlineData("1-propanol", 25, 0.7997, 0.00005)]   // §7 M (from memory)
    [InlineData("2-propanol", 20, 0.7855, 0.00005)]   // §7 M (from memory)
    [InlineData("2-propanol", 25, 0.7809, 0.00005)]   // §7 M (from memory)
    [InlineData("acetone", 25, 0.7845, 0.00005)]      // §7 V
    [InlineData("acetone", 20, 0.7899, 0.00015)]      // §7 M, through the −0.0011 coefficient (M)
    [InlineData("hcl-37", 20, 1.184, 0.0005)]         // §7 V (interpolated between 36 % and 38 %)
    [InlineData("hno3-68", 20, 1.4048, 0.00005)]      // §7 V (Perry 6th ed. table)
    [InlineData("nh3-28", 20, 0.898, 0.0005)]         // §7 M (CRC from memory), inside the V2 bracket 0.89–0.90
    [InlineData("water", 20, 0.99821, 0.000005)]      // §5 V
    public void Catalog_density_matches_the_published_value(string id, double temperatureC, double expectedGPerMl, double tolerance)
    {
        Assert.Equal(expectedGPerMl, Catalog.Find(id)!.Definition.Density.DensityGPerMl(temperatureC), tolerance);
    }

    [Theory]
    [InlineData(15, 999.1026)]  // Tanaka 2001 (published-values §5, V)
    [InlineData(20, 998.2067)]  // §5 V
    [InlineData(25, 997.0470)]  // §5 C from the V formula
    [InlineData(30, 995.6488)]  // §5 V
    public void Water_from_the_catalog_follows_Tanaka_2001(double temperatureC, double expectedKgPerM3)
    {
        Assert.Equal(expectedKgPerM3 / 1000, Catalog.Find("water")!.Definition.Density.DensityGPerMl(temperatureC), 1e-7);
    }

    [Theory]
    [InlineData("hcl-0.1m", 0.1, 1.0000)]  // made up by molarity; density 1.0000 g/mL at 20 °C (from memory)
    [InlineData("nh3-1m", 1.0, 0.9907)]    // made up by molarity; density 0.9907 g/mL at 20 °C (from memory)
    public void Dilute_solutions_give_back_their_molarity_at_20_C(string id, double molPerL, double densityGPerMl)
    {
        var reagent = Catalog.Find(id)!;
        Assert.Equal(densityGPerMl, reagent.Definition.Density.DensityGPerMl(20), 1e-9);
        // One litre weighs 1000·ρ g and holds ActiveMolPerG mol of solute in each gram.
        Assert.Equal(molPerL, reagent.ActiveMolPerG * 1000 * densityGPerMl, 1e-9);
    }

    [Fact]
    public void Hcl_0_1_M_mass_fraction_is_the_hand_calculation()
    {
        // 0.1 mol/L × 36.458 g/mol = 3.6458 g per litre weighing 1000.0 g: w = 0.0036458 (C).
        var hcl = Catalog.Find("hcl-0.1m")!.Definition;
        Assert.Equal(0.36458, hcl.AssayPct, 1e-9);
        Assert.Equal(0.9963542, hcl.Constituents.Single().MassFraction, 1e-9);
    }

    [Fact]
    public void Dilute_solutions_follow_waters_temperature_curve()
    {
        // Below 20 °C water gets denser, then lighter again below 4 °C; the dilute acid keeps that shape (Tanaka 2001).
        var density = Catalog.Find("hcl-0.1m")!.Definition.Density;
        Assert.True(density.DensityGPerMl(10) > density.DensityGPerMl(20));
        Assert.True(density.DensityGPerMl(40) < density.DensityGPerMl(30));
        Assert.Equal(0.99970 + 0.00179, density.DensityGPerMl(10), 0.00002);  // Tanaka 999.70 kg/m³ at 10 °C (C) plus 0.00179
    }

    [Theory]
    [InlineData("teos", 60.083)]            // published-values §9: SiO2 60.08 g per mol of precursor (C)
    [InlineData("tmos", 60.083)]            // §9
    [InlineData("mtms", 67.12)]             // §9 CH3SiO1.5 67.12 g (C)
    [InlineData("mtes", 67.12)]             // §9
    [InlineData("ttip", 79.865)]            // §9 TiO2 79.87 g (C)
    [InlineData("tbot", 79.865)]            // §9
    [InlineData("zr-npropoxide-70", 123.22)] // §9 ZrO2 123.22 g (C)
    [InlineData("al-sbutoxide", 50.98)]     // §9 ½ Al2O3 50.98 g (C)
    public void Oxide_formed_per_mole_of_precursor_matches_the_stoichiometry(string id, double expectedGPerMol)
    {
        var r = Catalog.Find(id)!;
        Assert.Equal(expectedGPerMol, r.OxideGPerG / r.PrecursorMolPerG, 0.005);
    }

    [Fact]
    public void Teos_is_28_8_percent_silica_by_mass()
    {
        // 60.083 / 208.33 = 0.2884 g SiO2 per g TEOS (C from §7 molar masses; the 28.8 % figure is common practice).
        Assert.Equal(0.2884, Catalog.Find("teos")!.OxideGPerG, 0.0001);
    }
}
