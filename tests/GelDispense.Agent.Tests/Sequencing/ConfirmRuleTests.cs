using GelDispense.Agent.Formats;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Stability;

namespace GelDispense.Agent.Tests.Sequencing;

public sealed class ConfirmRuleTests
{
    private static readonly StepWindow Window = new(0, TargetReadingG: 10, LowReadingG: 9.9, HighReadingG: 10.1, TrueGPerReadingG: 1, MlPerReadingG: null);

    private static StabilityVerdict Weight(double grossG, bool stable) =>
        new(new BalanceReading(grossG, stable, ReadingKind.Weight, "line"), stable, StabilityBasis.BalanceFlag, null);

    private static StabilityVerdict Marker(ReadingKind kind) =>
        new(BalanceReading.Marker(kind, "line"), false, StabilityBasis.NoMass, null);

    [Theory]
    [InlineData(ReadingKind.Overload)]
    [InlineData(ReadingKind.Underload)]
    [InlineData(ReadingKind.Error)]
    public void An_overload_underload_or_error_reading_is_never_confirmed_even_with_the_key(ReadingKind kind)
    {
        Assert.False(ConfirmRule.Decide(Marker(kind), true, Window, 0, ConfirmMode.Auto, false).Confirm);
        Assert.False(ConfirmRule.Decide(Marker(kind), true, Window, 0, ConfirmMode.Key, true).Confirm);
    }

    [Fact]
    public void An_unstable_reading_in_the_window_is_never_confirmed_even_with_the_key()
    {
        Assert.False(ConfirmRule.Decide(Weight(10, false), true, Window, 0, ConfirmMode.Auto, false).Confirm);
        Assert.False(ConfirmRule.Decide(Weight(10, false), true, Window, 0, ConfirmMode.Key, true).Confirm);
    }

    [Fact]
    public void A_stable_reading_is_not_confirmed_while_the_balance_link_is_down()
    {
        var decision = ConfirmRule.Decide(Weight(10, true), false, Window, 0, ConfirmMode.Auto, false);

        Assert.False(decision.Confirm);
        Assert.Contains("link", decision.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Auto_mode_waits_below_the_window_and_confirms_inside_and_past_it()
    {
        var below = ConfirmRule.Decide(Weight(9.8, true), true, Window, 0, ConfirmMode.Auto, false);
        var inside = ConfirmRule.Decide(Weight(10.05, true), true, Window, 0, ConfirmMode.Auto, false);
        var over = ConfirmRule.Decide(Weight(10.4, true), true, Window, 0, ConfirmMode.Auto, false);

        Assert.False(below.Confirm);
        Assert.Equal(WindowPosition.Below, below.Position);
        Assert.True(inside.Confirm);
        Assert.Equal(WindowPosition.Inside, inside.Position);
        Assert.True(over.Confirm);
        Assert.Equal(WindowPosition.Above, over.Position);
    }

    [Fact]
    public void The_net_reading_counts_from_the_steps_zero()
    {
        var decision = ConfirmRule.Decide(Weight(35.0, true), true, Window, baselineG: 25.0, ConfirmMode.Auto, false);

        Assert.True(decision.Confirm);
        Assert.Equal(10.0, decision.NetReadingG!.Value, 12);
    }

    [Fact]
    public void Key_mode_confirms_only_when_the_key_is_pressed_and_then_also_below_the_window()
    {
        Assert.False(ConfirmRule.Decide(Weight(10, true), true, Window, 0, ConfirmMode.Key, false).Confirm);
        Assert.True(ConfirmRule.Decide(Weight(10, true), true, Window, 0, ConfirmMode.Key, true).Confirm);
        Assert.True(ConfirmRule.Decide(Weight(5, true), true, Window, 0, ConfirmMode.Key, true).Confirm);
    }

    [Fact]
    public void A_net_reading_below_zero_is_never_confirmed()
    {
        Assert.False(ConfirmRule.Decide(Weight(-0.5, true), true, Window, 0, ConfirmMode.Key, true).Confirm);
    }

    [Fact]
    public void A_pipette_delivery_is_confirmed_once_weighed_even_a_display_step_short_of_the_window()
    {
        var byVolume = Window with { MlPerReadingG = 1.0 };

        var partial = ConfirmRule.Decide(Weight(4.0, true), true, byVolume, 0, ConfirmMode.Auto, false);
        var delivered = ConfirmRule.Decide(Weight(9.89, true), true, byVolume, 0, ConfirmMode.Auto, false);

        Assert.False(partial.Confirm);
        Assert.True(delivered.Confirm);
        Assert.Equal(WindowPosition.Below, delivered.Position);
    }
}
