using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Formulas;

namespace GelDispense.Chemistry.Tests.Formulas;

public class FormulaParserTests
{
    [Theory]
    [InlineData("SiXx2", "unknown element 'Xx' at position 3")]
    [InlineData("h2o", "element symbols start with a capital letter, found 'h' at position 1")]
    [InlineData("Si(OC2H5", "bracket opened at position 3 is not closed with ')' at position 3")]
    [InlineData("Si(OC2H5]4", "bracket opened at position 3 is not closed with ')' at position 3")]
    [InlineData("SiO2)", "closing bracket without an opening one at position 5")]
    [InlineData("AlO1.", "a decimal point must be followed by digits at position 6")]
    [InlineData("Si()4", "empty brackets at position 3")]
    [InlineData("H0", "an atom count must be positive at position 2")]
    [InlineData("SiO2 + H2O", "unexpected ' ' at position 5")]
    [InlineData("CuSO4·", "a hydrate separator must be followed by a formula part at position 7")]
    [InlineData("CuSO4·0H2O", "a hydrate coefficient must be positive at position 7")]
    public void A_malformed_formula_is_an_error_naming_field_value_position_and_reason(string text, string reason)
    {
        var e = Assert.Throws<InvalidInputException>(() => ChemicalFormula.Parse(text, "recipe.inlineReagents[0].formula"));
        var error = Assert.Single(e.Errors);
        Assert.Equal("recipe.inlineReagents[0].formula", error.Field);
        Assert.Equal(text, error.Value);
        Assert.Equal(reason, error.Reason);
    }

    [Theory]
    [InlineData("")]
    [InlineData("   ")]
    [InlineData(null)]
    public void An_empty_formula_is_an_error_saying_a_formula_is_required(string? text)
    {
        var e = Assert.Throws<InvalidInputException>(() => ChemicalFormula.Parse(text!));
        Assert.Equal("formula", e.Errors[0].Field);
        Assert.Equal("a formula is required", e.Errors[0].Reason);
    }

    [Fact]
    public void An_overlong_formula_is_refused_before_parsing()
    {
        var e = Assert.Throws<InvalidInputException>(() => ChemicalFormula.Parse(string.Concat(Enumerable.Repeat("CH2", 100))));
        Assert.Contains("at most 256 characters", e.Errors[0].Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Deeply_nested_brackets_are_refused_instead_of_overflowing_the_stack()
    {
        var text = new string('(', 40) + "H" + new string(')', 40);
        var e = Assert.Throws<InvalidInputException>(() => ChemicalFormula.Parse(text));
        Assert.Contains("nested deeper than", e.Errors[0].Reason, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("CuSO4·5H2O")]
    [InlineData("CuSO4.5H2O")]
    [InlineData("CuSO4*5H2O")]
    [InlineData(" CuSO4·5H2O ")]
    public void Hydrate_spellings_give_the_same_atoms(string text)
    {
        var f = ChemicalFormula.Parse(text);
        Assert.Equal(1, f.Count("Cu"));
        Assert.Equal(1, f.Count("S"));
        Assert.Equal(9, f.Count("O"));
        Assert.Equal(10, f.Count("H"));
    }

    [Fact]
    public void A_hemihydrate_takes_a_decimal_coefficient()
    {
        // CaSO4·0.5H2O, plaster of Paris: 40.078 + 32.06 + 4 × 15.999 = 136.134, plus 0.5 × 18.015 gives 145.14 g/mol
        // (IUPAC conventional weights, C; handbooks list 145.14–145.15, from memory).
        var f = ChemicalFormula.Parse("CaSO4·0.5H2O");
        Assert.Equal(1, f.Count("H"));
        Assert.Equal(4.5, f.Count("O"));
        Assert.Equal(145.14, f.MolarMassGPerMol, 0.005);
    }

    [Property]
    public Property Parsing_A_hydrate_n_B_equals_A_plus_n_times_B() =>
        Prop.ForAll(
            FormulaGen.Terms.ToArbitrary(),
            FormulaGen.Terms.ToArbitrary(),
            Gen.Zip(Gen.Choose(1, 12), Gen.Elements("·", ".")).ToArbitrary(),
            (a, b, coefficient) =>
            {
                var (n, separator) = coefficient;
                var partA = ChemicalFormula.Parse(FormulaGen.Text(a));
                var partB = ChemicalFormula.Parse(FormulaGen.Text(b));
                var hydrate = ChemicalFormula.Parse($"{FormulaGen.Text(a)}{separator}{n}{FormulaGen.Text(b)}");
                var symbols = partA.Atoms.Keys.Union(partB.Atoms.Keys).ToList();
                return symbols.Count == hydrate.Atoms.Count
                    && symbols.All(s => Math.Abs(hydrate.Count(s) - (partA.Count(s) + (n * partB.Count(s)))) < 1e-9)
                    && Math.Abs(hydrate.MolarMassGPerMol - (partA.MolarMassGPerMol + (n * partB.MolarMassGPerMol))) < 1e-9;
            });
}
