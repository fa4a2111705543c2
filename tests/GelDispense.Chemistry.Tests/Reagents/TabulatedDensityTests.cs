using GelDispense.Chemistry.Reagents;

// See BuiltInReagentsTests for why this is not GelDispense.Chemistry.Tests.Reagents.
namespace GelDispense.Chemistry.Tests.ReagentsTests;

public class TabulatedDensityTests
{
    // Ethanol table points 10, 20 and 30 °C (published-values §7, V), given out of order on purpose.
    private static readonly TabulatedDensity Ethanol = new([(30, 0.7807), (10, 0.7978), (20, 0.7893)]);

    [Theory]
    [InlineData(10, 0.7978)]
    [InlineData(20, 0.7893)]
    [InlineData(30, 0.7807)]
    [InlineData(15, 0.79355)]   // halfway between 0.7978 and 0.7893
    [InlineData(25, 0.7850)]    // halfway between 0.7893 and 0.7807; §7 V gives 0.7850 at 25 °C
    public void Interpolates_linearly_between_the_table_points(double temperatureC, double expectedGPerMl)
    {
        Assert.Equal(expectedGPerMl, Ethanol.DensityGPerMl(temperatureC), 1e-9);
    }

    [Fact]
    public void Covers_exactly_the_span_of_its_points()
    {
        Assert.Equal(10, Ethanol.MinTemperatureC);
        Assert.Equal(30, Ethanol.MaxTemperatureC);
        Assert.True(Ethanol.Covers(30));
        Assert.False(Ethanol.Covers(30.1));
        Assert.False(Ethanol.Covers(9.9));
    }

    [Fact]
    public void A_table_needs_two_points()
    {
        Assert.Throws<ArgumentException>(() => new TabulatedDensity([(20, 0.7893)]));
    }
}
