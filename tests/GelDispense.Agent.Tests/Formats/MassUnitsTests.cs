using GelDispense.Agent.Formats;

namespace GelDispense.Agent.Tests.Formats;

public class MassUnitsTests
{
    // SI Brochure (BIPM, 9th ed. 2019), Table 7: milli = 1e-3, kilo = 1e3.
    [Theory]
    [InlineData(1234.5, "mg", 1.2345)]
    [InlineData(1234.5, "MG", 1.2345)]
    [InlineData(0.25, "kg", 250.0)]
    [InlineData(0.25, "KG", 250.0)]
    [InlineData(12.3456, "g", 12.3456)]
    [InlineData(-0.0012, "G", -0.0012)]
    public void Converts_SI_mass_units_to_grams(double value, string unit, double expectedG)
    {
        Assert.True(MassUnits.TryToGrams(value, unit, out var valueG));
        Assert.Equal(expectedG, valueG, 12);
    }

    // A metric carat is exactly 0.2 g (common practice, CGPM 1907) and an ounce is 28.349523125 g,
    // but neither belongs in a dispensing log: refusing them is the point.
    [Theory]
    [InlineData("ct")]
    [InlineData("oz")]
    [InlineData("lb")]
    [InlineData("gr")]
    [InlineData("pcs")]
    [InlineData("%")]
    [InlineData("")]
    [InlineData("Kg")]
    public void Refuses_units_it_cannot_convert(string unit)
    {
        Assert.False(MassUnits.TryToGrams(5.0, unit, out var valueG));
        Assert.True(double.IsNaN(valueG));
    }
}
