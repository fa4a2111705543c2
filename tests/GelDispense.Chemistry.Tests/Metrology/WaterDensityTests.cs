using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Tests.Metrology;

public class WaterDensityTests
{
    [Theory]
    [InlineData(15, 999.1026)] // Tanaka 2001, Metrologia 38, 301: 15 °C value published (V)
    [InlineData(20, 998.2067)] // Tanaka 2001: published (V)
    [InlineData(25, 997.0470)] // calculated from the Tanaka 2001 formula (C)
    [InlineData(30, 995.6488)] // Tanaka 2001: published (V)
    public void Tanaka2001_matches_published_and_calculated_values(double temperatureC, double expectedKgPerM3)
    {
        Assert.Equal(expectedKgPerM3, WaterDensity.Tanaka2001KgPerM3(temperatureC), 0.0001);
    }

    [Fact]
    public void Tanaka2001_at_37_5_C_agrees_with_the_formula_written_out_here()
    {
        // Tanaka 2001 coefficients a1..a5 (Metrologia 38, 301), evaluated independently of the library.
        const double t = 37.5;
        var expected = 999.974950 * (1 - (Math.Pow(t - 3.983035, 2) * (t + 301.797) / (522528.9 * (t + 69.34881))));
        Assert.Equal(expected, WaterDensity.Tanaka2001KgPerM3(t), 1e-9);
    }

    [Fact]
    public void Tanaka2001_peaks_at_a5_where_t_equals_minus_a1()
    {
        // Tanaka 2001: at t = −a1 = 3.983035 °C the bracket is 1, so ρ = a5 = 999.974950 kg/m³, the maximum.
        Assert.Equal(999.974950, WaterDensity.Tanaka2001KgPerM3(3.983035), 1e-9);
        Assert.True(WaterDensity.Tanaka2001KgPerM3(3.5) < 999.974950);
        Assert.True(WaterDensity.Tanaka2001KgPerM3(4.5) < 999.974950);
    }

    [Fact]
    public void Tanaka2001_in_g_per_ml_is_the_kg_per_m3_value_over_1000()
    {
        // CRC handbook / Tanaka 2001: water at 20 °C is 0.99821 g/cm³ (V).
        Assert.Equal(0.99821, WaterDensity.Tanaka2001GPerMl(20), 0.000005);
    }

    [Theory]
    [InlineData(15, 999.0996)] // Kell 1975, J. Chem. Eng. Data 20, 97, calculated (C)
    [InlineData(20, 998.2041)] // Kell 1975 (C); the 16.897850e-3 typo would give 997.94
    [InlineData(25, 997.0449)] // Kell 1975 (C)
    [InlineData(30, 995.6473)] // Kell 1975 (C)
    public void Kell1975_matches_calculated_values(double temperatureC, double expectedKgPerM3)
    {
        Assert.Equal(expectedKgPerM3, WaterDensity.Kell1975KgPerM3(temperatureC), 0.0001);
    }

    [Fact]
    public void Kell_and_Tanaka_agree_within_a_few_thousandths_of_a_kg_per_m3_from_0_to_40_C()
    {
        // The two formulas differ by at most 0.003 kg/m³ at the tabulated points (Tanaka vs Kell, C values);
        // 0.01 kg/m³ allows for the ITS-90/IPTS-68 and SMOW differences across the range.
        for (var t = 0; t <= 40; t++)
        {
            Assert.InRange(WaterDensity.Kell1975KgPerM3(t) - WaterDensity.Tanaka2001KgPerM3(t), -0.01, 0.01);
        }
    }

    [Theory]
    [InlineData(-0.1)]
    [InlineData(40.1)]
    [InlineData(double.NaN)]
    public void Tanaka2001_outside_0_to_40_C_throws_naming_the_temperature(double temperatureC)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => WaterDensity.Tanaka2001KgPerM3(temperatureC));
        Assert.Equal("temperatureC", error.ParamName);
    }

    [Fact]
    public void Kell1975_above_100_C_throws_naming_the_temperature()
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => WaterDensity.Kell1975KgPerM3(100.5));
        Assert.Equal("temperatureC", error.ParamName);
    }
}
