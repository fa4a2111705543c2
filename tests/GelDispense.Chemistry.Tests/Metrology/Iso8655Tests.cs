using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Tests.Metrology;

public class Iso8655Tests
{
    [Fact]
    public void The_1000_uL_row_is_8_uL_systematic_and_3_uL_random()
    {
        // ISO 8655-2, 1000 µL: ±0.8 % = ±8 µL systematic, 0.3 % = 3 µL random (V: TSI 2019 paper Table 2).
        Assert.Equal((8.0, 3.0), Iso8655.MaximumPermissibleErrorsUl(1000));
    }

    [Theory]
    // ISO 8655-2 single-channel air-displacement table, from memory: nominal, systematic %, random %.
    [InlineData(1, 5.0, 5.0)]
    [InlineData(2, 4.0, 2.0)]
    [InlineData(5, 2.5, 1.5)]
    [InlineData(10, 1.2, 0.8)]
    [InlineData(20, 1.0, 0.5)]
    [InlineData(50, 1.0, 0.4)]
    [InlineData(100, 0.8, 0.3)]
    [InlineData(200, 0.8, 0.3)]
    [InlineData(500, 0.8, 0.3)]
    [InlineData(2000, 0.8, 0.3)]
    [InlineData(5000, 0.8, 0.3)]
    [InlineData(10000, 0.6, 0.3)]
    public void Rows_from_memory_give_the_percentage_of_nominal_in_uL(double nominalUl, double systematicPct, double randomPct)
    {
        var (systematicUl, randomUl) = Iso8655.MaximumPermissibleErrorsUl(nominalUl);
        Assert.Equal(systematicPct * nominalUl / 100, systematicUl, 1e-12);
        Assert.Equal(randomPct * nominalUl / 100, randomUl, 1e-12);
    }

    [Theory]
    [InlineData(300, 4.0, 1.5)]  // between 200 and 500: the 500 µL row (our conservative rule)
    [InlineData(250, 4.0, 1.5)]
    [InlineData(1.5, 0.08, 0.04)] // between 1 and 2: the 2 µL row
    [InlineData(7500, 60, 30)]    // between 5000 and 10000: the 10 000 µL row
    public void A_nominal_between_rows_takes_the_uL_limits_of_the_next_larger_row(double nominalUl, double systematicUl, double randomUl)
    {
        Assert.Equal((systematicUl, randomUl), Iso8655.MaximumPermissibleErrorsUl(nominalUl));
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(10001)]
    [InlineData(double.NaN)]
    public void A_nominal_outside_the_table_throws(double nominalUl)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => Iso8655.MaximumPermissibleErrorsUl(nominalUl));
        Assert.Equal("nominalVolumeUl", error.ParamName);
        Assert.False(Iso8655.Covers(nominalUl));
    }
}
