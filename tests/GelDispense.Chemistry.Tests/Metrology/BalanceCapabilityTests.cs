using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Tests.Metrology;

public class BalanceCapabilityTests
{
    // 2·√2·0.41: the readability-only bound of a difference of two readings, in multiples of d (our model).
    private static readonly double FloorPerD = 2 * Math.Sqrt(2) * 0.41;

    [Fact]
    public void Usp_minimum_weight_of_the_USP_41_example_is_0_300_g()
    {
        // USP <41>: s = 0.00015 g gives m_min = 2000 × 0.00015 = 0.300 g (V).
        Assert.Equal(0.300, BalanceCapability.UspMinimumWeightG(new BalanceProfile(0.0001, 220, RepeatabilityG: 0.00015)), 1e-12);
    }

    [Fact]
    public void Usp_minimum_weight_uses_0_41_d_when_s_is_smaller()
    {
        // USP <41> s floor (V2): d = 0.1 mg, s = 0.02 mg → s′ = 0.041 mg → 82 mg (C).
        Assert.Equal(0.082, BalanceCapability.UspMinimumWeightG(new BalanceProfile(0.0001, 220, RepeatabilityG: 0.00002)), 1e-12);
    }

    [Fact]
    public void Usp_minimum_weight_without_s_is_820_d()
    {
        // Vendor summary of USP <41>: smallest net weight 820·d = 2000 × 0.41·d (V2).
        Assert.Equal(820 * 0.001, BalanceCapability.UspMinimumWeightG(new BalanceProfile(0.001, 620)), 1e-12);
    }

    [Fact]
    public void Expected_error_with_known_s_is_the_k2_uncertainty_of_a_difference()
    {
        // Our model: 2·√2·max(s, 0.41 d); USP <41> floor; GUM k = 2 and √2 for two readings (common practice).
        var p = new BalanceProfile(0.0001, 220, RepeatabilityG: 0.00015, AccuracyClass: AccuracyClass.I, VerificationIntervalG: 0.001);
        Assert.Equal(2 * Math.Sqrt(2) * 0.00015, BalanceCapability.ExpectedErrorG(p, 1, 60), 1e-15);
    }

    [Fact]
    public void Expected_error_without_s_takes_the_R76_mpe_at_the_gross_load()
    {
        // OIML R 76-1 Table 6: class I, e = 1 mg, 60 g = 60 000 e → ±1.0 e (V).
        var p = new BalanceProfile(0.0001, 220, AccuracyClass: AccuracyClass.I, VerificationIntervalG: 0.001);
        Assert.Equal(0.001, BalanceCapability.ExpectedErrorG(p, 1, 60), 1e-15);
        Assert.Equal(0.0005, BalanceCapability.ExpectedErrorG(p, 1, 40), 1e-15);
    }

    [Fact]
    public void Expected_error_without_s_never_falls_below_the_readability_bound()
    {
        // Class II with e = d = 10 mg: R 76 gives 0.5 e = 5 mg at a low load, below 1.16 d = 11.6 mg.
        var p = new BalanceProfile(0.01, 620, AccuracyClass: AccuracyClass.II, VerificationIntervalG: 0.01);
        Assert.Equal(FloorPerD * 0.01, BalanceCapability.ExpectedErrorG(p, 5, 40), 1e-15);
    }

    [Fact]
    public void Expected_error_with_readability_only_is_the_floor()
    {
        Assert.Equal(FloorPerD * 0.001, BalanceCapability.ExpectedErrorG(new BalanceProfile(0.001, 620), 10, 100), 1e-15);
    }

    [Property]
    public Property No_profile_looks_better_than_the_readability_bound() =>
        Prop.ForAll(
            MetrologyGen.ArbBetween(0, 0.001),
            MetrologyGen.ArbBetween(0.001, 200),
            (s, netG) =>
            {
                var p = new BalanceProfile(0.0001, 220, RepeatabilityG: s);
                return BalanceCapability.ExpectedErrorG(p, netG, netG + 20) >= (FloorPerD * 0.0001) - 1e-18;
            });

    [Fact]
    public void Can_weigh_a_net_mass_above_both_minimum_weights_within_capacity()
    {
        var p = new BalanceProfile(0.0001, 220, RepeatabilityG: 0.00015, MinimumWeightG: 0.1);
        Assert.True(BalanceCapability.CanWeigh(p, 0.300, 80, out var reason));
        Assert.Equal(string.Empty, reason);
    }

    [Theory]
    [InlineData(5, 221, "capacity")]
    [InlineData(0.05, 80, "minimum weight 0.1 g set for this balance")]
    [InlineData(0.25, 80, "USP <41> minimum weight 0.3 g")]
    public void Cannot_weigh_says_why(double netG, double grossG, string because)
    {
        var p = new BalanceProfile(0.0001, 220, RepeatabilityG: 0.00015, MinimumWeightG: 0.1);
        Assert.False(BalanceCapability.CanWeigh(p, netG, grossG, out var reason));
        Assert.Contains(because, reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Loads_outside_their_range_throw_naming_the_parameter()
    {
        var p = new BalanceProfile(0.0001, 220);
        Assert.Equal("grossLoadG", Assert.Throws<ArgumentOutOfRangeException>(() => BalanceCapability.ExpectedErrorG(p, 1, 221)).ParamName);
        Assert.Equal("grossLoadG", Assert.Throws<ArgumentOutOfRangeException>(() => BalanceCapability.ExpectedErrorG(p, 2, 1)).ParamName);
        Assert.Equal("netMassG", Assert.Throws<ArgumentOutOfRangeException>(() => BalanceCapability.CanWeigh(p, 0, 1, out _)).ParamName);
    }
}
