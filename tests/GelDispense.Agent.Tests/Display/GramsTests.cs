using GelDispense.Agent.Display;

namespace GelDispense.Agent.Tests.Display;

public sealed class GramsTests
{
    [Theory]
    [InlineData(2.5, 2, "+2.50")]
    [InlineData(-0.404, 2, "-0.40")]
    [InlineData(-0.001, 2, "0.00")]
    [InlineData(0.004, 2, "0.00")]
    [InlineData(-3.25, 1, "-3.2")]
    public void A_signed_figure_never_shows_a_sign_on_a_zero(double value, int decimals, string expected)
    {
        Assert.Equal(expected, Grams.Signed(value, decimals));
    }

    [Theory]
    [InlineData(12.34567, 0.001, "12.346 g")]
    [InlineData(12.34567, 0.01, "12.35 g")]
    [InlineData(12.34567, 0.0001, "12.3457 g")]
    public void A_mass_is_shown_to_the_balances_readability(double valueG, double readabilityG, string expected)
    {
        Assert.Equal(expected, Grams.Text(valueG, readabilityG));
    }
}
