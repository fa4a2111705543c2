using GelDispense.Agent.Display;

namespace GelDispense.Agent.Tests.Display;

public sealed class TargetBarTests
{
    // Window 9..11 g on a 20-cell bar: the scale runs to 1.25 × 11 = 13.75 g, 0.6875 g a cell, so the band covers cells 13–15.
    [Theory]
    [InlineData(0.0, ".............[   ]....")]
    [InlineData(5.0, "#######......[   ]....")]
    [InlineData(10.0, "#############[== ]....")]
    [InlineData(13.0, "#############[===]###.")]
    public void The_bar_fills_toward_the_target_with_the_window_bracketed(double netG, string expected)
    {
        Assert.Equal(expected, TargetBar.Render(netG, 9, 11, 20));
    }

    [Fact]
    public void A_reading_far_past_the_window_stretches_the_scale_so_the_bar_stays_full_not_clipped()
    {
        var bar = TargetBar.Render(40, 9, 11, 20);

        Assert.Equal(22, bar.Length);
        Assert.EndsWith("#", bar, StringComparison.Ordinal);
        Assert.DoesNotContain(".", bar, StringComparison.Ordinal);
    }

    [Fact]
    public void A_negative_or_missing_reading_draws_an_empty_bar()
    {
        Assert.Equal(TargetBar.Render(0, 9, 11, 20), TargetBar.Render(-3, 9, 11, 20));
        Assert.Equal(TargetBar.Render(0, 9, 11, 20), TargetBar.Render(null, 9, 11, 20));
    }
}
