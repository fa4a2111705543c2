using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Tests.Metrology;

public class OimlR76Tests
{
    // OIML R 76-1 Table 6, initial verification (V; also UK NAWI Regulations 1995 Table 3).
    // Each row: class, e (g), load (g), expected mpe in multiples of e. Edges are inclusive.
    public static TheoryData<AccuracyClass, double, double, double> BandEdges => new()
    {
        { AccuracyClass.I, 0.001, 0, 0.5 },
        { AccuracyClass.I, 0.001, 50, 0.5 },        // 50 000 e
        { AccuracyClass.I, 0.001, 50.001, 1.0 },
        { AccuracyClass.I, 0.001, 200, 1.0 },       // 200 000 e
        { AccuracyClass.I, 0.001, 200.001, 1.5 },
        { AccuracyClass.II, 0.01, 50, 0.5 },        // 5 000 e
        { AccuracyClass.II, 0.01, 50.01, 1.0 },
        { AccuracyClass.II, 0.01, 200, 1.0 },       // 20 000 e
        { AccuracyClass.II, 0.01, 200.01, 1.5 },
        { AccuracyClass.II, 0.01, 1000, 1.5 },      // 100 000 e
        { AccuracyClass.II, 0.001, 5, 0.5 },        // 5 000 e with a binary-inexact e
        { AccuracyClass.II, 0.001, 5 + 1e-12, 0.5 }, // a summed gross load a rounding hair above the edge
        { AccuracyClass.III, 1, 500, 0.5 },         // 500 e
        { AccuracyClass.III, 1, 501, 1.0 },
        { AccuracyClass.III, 1, 2000, 1.0 },        // 2 000 e
        { AccuracyClass.III, 1, 2001, 1.5 },
        { AccuracyClass.III, 1, 10000, 1.5 },       // 10 000 e
        { AccuracyClass.IIII, 5, 250, 0.5 },        // 50 e
        { AccuracyClass.IIII, 5, 255, 1.0 },
        { AccuracyClass.IIII, 5, 1000, 1.0 },       // 200 e
        { AccuracyClass.IIII, 5, 1005, 1.5 },
        { AccuracyClass.IIII, 5, 5000, 1.5 },       // 1 000 e
    };

    [Theory]
    [MemberData(nameof(BandEdges))]
    public void Initial_mpe_follows_the_Table_6_bands(AccuracyClass c, double e, double loadG, double mpeInE)
    {
        Assert.Equal(mpeInE * e, OimlR76.MaximumPermissibleErrorG(c, e, loadG), 1e-12);
    }

    [Theory]
    [MemberData(nameof(BandEdges))]
    public void In_service_mpe_is_twice_the_initial_mpe(AccuracyClass c, double e, double loadG, double mpeInE)
    {
        // OIML R 76-1: in-service mpe = 2 × initial (V).
        Assert.Equal(2 * mpeInE * e, OimlR76.MaximumPermissibleErrorG(c, e, loadG, inService: true), 1e-12);
    }

    [Theory]
    [InlineData(AccuracyClass.II, 0.01, 1000.01)] // above 100 000 e
    [InlineData(AccuracyClass.III, 1, 10001)]     // above 10 000 e
    [InlineData(AccuracyClass.IIII, 5, 5005)]     // above 1 000 e
    public void A_load_beyond_the_last_band_has_no_mpe(AccuracyClass c, double e, double loadG)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => OimlR76.MaximumPermissibleErrorG(c, e, loadG));
        Assert.Equal("loadG", error.ParamName);
    }

    [Theory]
    [InlineData(AccuracyClass.I, 0.001, 0.1)]   // 100 e, R 76-1 Table 3 (V)
    [InlineData(AccuracyClass.II, 0.01, 0.2)]   // 20 e for e ≤ 0.05 g (V)
    [InlineData(AccuracyClass.II, 0.05, 1.0)]   // 20 e at the top of that range (V)
    [InlineData(AccuracyClass.II, 0.1, 5.0)]    // 50 e for e ≥ 0.1 g (V)
    [InlineData(AccuracyClass.III, 1, 20)]      // 20 e (V)
    [InlineData(AccuracyClass.IIII, 5, 50)]     // 10 e, from memory
    public void Minimum_capacity_follows_Table_3(AccuracyClass c, double e, double expectedG)
    {
        Assert.Equal(expectedG, OimlR76.MinimumCapacityG(c, e), 1e-12);
    }

    [Property]
    public Property Mpe_never_falls_as_the_load_grows() =>
        Prop.ForAll(
            MetrologyGen.ArbBetween(0, 1000),
            MetrologyGen.ArbBetween(0, 1000),
            (a, b) => OimlR76.MaximumPermissibleErrorG(AccuracyClass.II, 0.01, Math.Min(a, b))
                <= OimlR76.MaximumPermissibleErrorG(AccuracyClass.II, 0.01, Math.Max(a, b)));

    [Fact]
    public void Bad_arguments_throw_naming_the_parameter()
    {
        Assert.Equal("verificationIntervalG", Assert.Throws<ArgumentOutOfRangeException>(
            () => OimlR76.MaximumPermissibleErrorG(AccuracyClass.I, 0, 1)).ParamName);
        Assert.Equal("loadG", Assert.Throws<ArgumentOutOfRangeException>(
            () => OimlR76.MaximumPermissibleErrorG(AccuracyClass.I, 0.001, -1)).ParamName);
        Assert.Equal("accuracyClass", Assert.Throws<ArgumentOutOfRangeException>(
            () => OimlR76.MaximumPermissibleErrorG((AccuracyClass)9, 0.001, 1)).ParamName);
    }
}
