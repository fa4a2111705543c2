using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Tests.Metrology;

public class BalanceProfileTests
{
    private static readonly BalanceProfile Analytical = new(
        ReadabilityG: 0.0001, CapacityG: 220, RepeatabilityG: 0.00008, MinimumWeightG: 0.05,
        AccuracyClass: AccuracyClass.I, VerificationIntervalG: 0.001);

    [Fact]
    public void A_complete_profile_is_valid()
    {
        Assert.Empty(Analytical.Validate());
        Assert.Empty(new BalanceProfile(0.01, 6200).Validate());
    }

    [Fact]
    public void Zero_repeatability_is_valid_because_USP_41_floors_it()
    {
        // USP <41>: s below 0.41 d is replaced by 0.41 d, so s = 0 is a legitimate measurement (V2).
        Assert.Empty((Analytical with { RepeatabilityG = 0 }).Validate());
    }

    [Fact]
    public void Non_positive_and_non_finite_numbers_are_named_with_their_values()
    {
        var errors = new BalanceProfile(0, double.NaN, RepeatabilityG: -0.1, MinimumWeightG: double.PositiveInfinity).Validate();

        Assert.Equal(
            ["balance.readabilityG", "balance.capacityG", "balance.repeatabilityG", "balance.minimumWeightG"],
            errors.Select(e => e.Field));
        Assert.Equal("0", errors[0].Value);
        Assert.Equal("NaN", errors[1].Value);
        Assert.Equal("-0.1", errors[2].Value);
    }

    [Fact]
    public void Capacity_must_exceed_readability_and_minimum_weight_must_fit_the_capacity()
    {
        Assert.Equal("balance.capacityG", Assert.Single(new BalanceProfile(1, 0.5).Validate()).Field);
        Assert.Equal("balance.minimumWeightG", Assert.Single((Analytical with { MinimumWeightG = 300 }).Validate()).Field);
    }

    [Fact]
    public void A_class_needs_an_interval_and_an_interval_needs_a_class()
    {
        var classOnly = Assert.Single((Analytical with { VerificationIntervalG = null }).Validate());
        Assert.Equal("balance.verificationIntervalG", classOnly.Field);

        var intervalOnly = Assert.Single((Analytical with { AccuracyClass = null }).Validate());
        Assert.Equal("balance.accuracyClass", intervalOnly.Field);
    }

    [Fact]
    public void An_interval_finer_than_the_readability_is_rejected()
    {
        var error = Assert.Single((Analytical with { VerificationIntervalG = 0.00001 }).Validate());
        Assert.Equal("balance.verificationIntervalG", error.Field);
        Assert.Contains("readability", error.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void A_capacity_beyond_the_class_mpe_table_is_rejected()
    {
        // OIML R 76-1 Table 6: class III ends at 10 000 e; 2000 g / 0.1 g = 20 000 e.
        var error = Assert.Single(new BalanceProfile(0.1, 2000, AccuracyClass: AccuracyClass.III, VerificationIntervalG: 0.1).Validate());
        Assert.Equal("balance.verificationIntervalG", error.Field);
    }

    [Fact]
    public void An_undefined_class_and_a_custom_prefix_show_in_the_field()
    {
        var error = Assert.Single((Analytical with { AccuracyClass = (AccuracyClass)12 }).Validate("stations[2].balance"));
        Assert.Equal("stations[2].balance.accuracyClass", error.Field);
    }
}
