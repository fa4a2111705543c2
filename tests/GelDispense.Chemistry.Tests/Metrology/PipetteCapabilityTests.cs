using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Tests.Metrology;

public class PipetteCapabilityTests
{
    private static readonly PipetteProfile P1000 = new("P1000-west", 1000, 100);

    [Fact]
    public void Expected_error_is_systematic_plus_twice_random()
    {
        // ISO 8655-2 1000 µL row (V): 8 + 2 × 3 = 14 µL, held over the useful range (2002 edition, V2).
        Assert.Equal(14.0, PipetteCapability.ExpectedErrorUl(P1000, 500), 1e-12);
    }

    [Property]
    public Property Expected_error_is_the_same_anywhere_in_the_useful_range() =>
        Prop.ForAll(
            MetrologyGen.ArbBetween(100, 1000),
            volumeUl => PipetteCapability.ExpectedErrorUl(P1000, volumeUl) == PipetteCapability.ExpectedErrorUl(P1000, 1000));

    [Fact]
    public void Custom_limits_override_the_table_one_by_one()
    {
        Assert.Equal((5.0, 3.0), PipetteCapability.MaximumPermissibleErrorsUl(P1000 with { SystematicMpeUl = 5 }));
        Assert.Equal((8.0, 1.0), PipetteCapability.MaximumPermissibleErrorsUl(P1000 with { RandomMpeUl = 1 }));
        Assert.Equal(5 + (2 * 1.0), PipetteCapability.ExpectedErrorUl(P1000 with { SystematicMpeUl = 5, RandomMpeUl = 1 }, 300), 1e-12);
    }

    [Theory]
    [InlineData(99.9, false)]
    [InlineData(100, true)]
    [InlineData(1000, true)]
    [InlineData(1000.1, false)]
    [InlineData(double.NaN, false)]
    public void Can_deliver_only_inside_the_useful_range(double volumeUl, bool expected)
    {
        Assert.Equal(expected, PipetteCapability.CanDeliver(P1000, volumeUl));
    }

    [Fact]
    public void Expected_error_outside_the_useful_range_throws_with_the_reason()
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => PipetteCapability.ExpectedErrorUl(P1000, 50));
        Assert.Equal("volumeUl", error.ParamName);
        Assert.Contains("useful range 100–1000 µL", error.Message, StringComparison.Ordinal);
    }
}
