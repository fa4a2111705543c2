using GelDispense.Chemistry.Reagents;

// See BuiltInReagentsTests for why this is not GelDispense.Chemistry.Tests.Reagents.
namespace GelDispense.Chemistry.Tests.ReagentsTests;

public class GhsStatementsTests
{
    private const string SdsLine = "Before handling, read each supplier's SDS and follow local safety rules; they take precedence over these notes.";
    private static readonly ReagentCatalog Catalog = BuiltInReagents.CreateCatalog();

    // Wording of the hazard statements: UN GHS, Annex 3 (H360D: EU CLP Annex III).
    [Theory]
    [InlineData("H225", "Highly flammable liquid and vapour")]
    [InlineData("H226", "Flammable liquid and vapour")]
    [InlineData("H272", "May intensify fire; oxidizer")]
    [InlineData("H290", "May be corrosive to metals")]
    [InlineData("H301", "Toxic if swallowed")]
    [InlineData("H314", "Causes severe skin burns and eye damage")]
    [InlineData("H318", "Causes serious eye damage")]
    [InlineData("H330", "Fatal if inhaled")]
    [InlineData("H335", "May cause respiratory irritation")]
    [InlineData("H360D", "May damage the unborn child")]
    [InlineData("H370", "Causes damage to organs")]
    [InlineData("H400", "Very toxic to aquatic life")]
    [InlineData(" h225 ", "Highly flammable liquid and vapour")]
    public void Codes_map_to_the_standard_hazard_statements(string code, string statement)
    {
        Assert.True(GhsStatements.TryGetStatement(code, out var text));
        Assert.Equal(statement, text);
    }

    [Fact]
    public void Letter_suffixes_are_case_sensitive()
    {
        // H361d (suspected of damaging the unborn child) is not H360D (may damage it).
        Assert.True(GhsStatements.TryGetStatement("H361d", out var suspected));
        Assert.Equal("Suspected of damaging the unborn child", suspected);
        Assert.False(GhsStatements.TryGetStatement("H361D", out _));
    }

    [Fact]
    public void Ethanol_cautions_list_its_statements_then_fire_advice_then_the_SDS_once()
    {
        var lines = GhsStatements.Cautions(["H319", "H225", "H225"]);
        Assert.Equal("H225: Highly flammable liquid and vapour.", lines[0]);
        Assert.Equal("H319: Causes serious eye irritation.", lines[1]);
        Assert.StartsWith("Flammable: no flames", lines[2], StringComparison.Ordinal);
        Assert.Equal(SdsLine, lines[^1]);
        Assert.Equal(4, lines.Count);
    }

    [Fact]
    public void Concentrated_acid_cautions_ask_for_eye_and_face_protection_and_a_non_metal_vessel()
    {
        var lines = GhsStatements.Cautions(Catalog.Find("hcl-37")!.Definition.GhsHazards);
        Assert.Contains(lines, l => l.StartsWith("Corrosive:", StringComparison.Ordinal) && l.Contains("eye and face protection", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.StartsWith("Corrodes metal:", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.StartsWith("Harmful or toxic vapour:", StringComparison.Ordinal));
        Assert.Single(lines, SdsLine);
    }

    [Fact]
    public void Nothing_to_caution_gives_no_lines()
    {
        Assert.Empty(GhsStatements.Cautions(Array.Empty<string>()));
        Assert.Empty(GhsStatements.Cautions([Catalog.Find("water")!]));
    }

    [Fact]
    public void An_unknown_code_is_shown_as_unknown_and_still_defers_to_the_SDS()
    {
        var lines = GhsStatements.Cautions(["H999"]);
        Assert.Equal(["H999: not a hazard code known here; see the SDS.", SdsLine], lines);
    }

    [Fact]
    public void Fluoride_catalyst_cautions_mention_hydrogen_fluoride_and_calcium_gluconate()
    {
        var lines = GhsStatements.Cautions([Catalog.Find("nh4f")!, Catalog.Find("hcl-0.1m")!]);
        Assert.Contains(lines, l => l.Contains("hydrogen fluoride", StringComparison.Ordinal) && l.Contains("calcium gluconate", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.StartsWith("Toxic on skin contact", StringComparison.Ordinal));
        Assert.Single(lines, SdsLine);
        Assert.Equal(SdsLine, lines[^1]);
    }

    [Fact]
    public void Alkoxide_cautions_mention_moisture_and_eye_protection_but_solvents_do_not()
    {
        var teos = GhsStatements.Cautions([Catalog.Find("teos")!]);
        Assert.Contains(teos, l => l.StartsWith("Metal alkoxide:", StringComparison.Ordinal) && l.Contains("moisture", StringComparison.Ordinal));
        var ethanol = GhsStatements.Cautions([Catalog.Find("ethanol")!]);
        Assert.DoesNotContain(ethanol, l => l.StartsWith("Metal alkoxide:", StringComparison.Ordinal));
        Assert.DoesNotContain(ethanol, l => l.StartsWith("Fluoride:", StringComparison.Ordinal));
    }

    [Fact]
    public void Formamide_and_methanol_get_the_long_term_health_line()
    {
        var lines = GhsStatements.Cautions([Catalog.Find("formamide")!, Catalog.Find("methanol")!]);
        Assert.Contains("H360D: May damage the unborn child.", lines);
        Assert.Contains(lines, l => l.StartsWith("Long-term health hazard", StringComparison.Ordinal));
    }
}
