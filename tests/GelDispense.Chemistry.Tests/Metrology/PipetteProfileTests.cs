using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Tests.Metrology;

public class PipetteProfileTests
{
    [Fact]
    public void A_table_pipette_and_a_custom_limit_pipette_are_valid()
    {
        Assert.Empty(new PipetteProfile("P1000-west", 1000, 100).Validate());
        // A 25 mL bottle-top dispenser is outside the ISO 8655-2 pipette table but carries its own limits.
        Assert.Empty(new PipetteProfile("dispenser-3", 25000, 2500, SystematicMpeUl: 150, RandomMpeUl: 25).Validate());
    }

    [Fact]
    public void Every_bad_field_is_named_with_its_value()
    {
        var errors = new PipetteProfile(" ", -5, double.NaN, SystematicMpeUl: 0, RandomMpeUl: double.PositiveInfinity).Validate();

        Assert.Equal(
            ["pipette.id", "pipette.nominalVolumeUl", "pipette.minVolumeUl", "pipette.systematicMpeUl", "pipette.randomMpeUl"],
            errors.Select(e => e.Field));
        Assert.Equal("-5", errors[1].Value);
    }

    [Fact]
    public void The_minimum_volume_must_not_exceed_the_nominal_volume()
    {
        var error = Assert.Single(new PipetteProfile("P200", 200, 250).Validate());
        Assert.Equal("pipette.minVolumeUl", error.Field);
    }

    [Fact]
    public void A_nominal_outside_the_table_needs_both_custom_limits()
    {
        var error = Assert.Single(new PipetteProfile("dispenser-3", 25000, 2500, SystematicMpeUl: 150).Validate("plan.pipette"));
        Assert.Equal("plan.pipette.nominalVolumeUl", error.Field);
        Assert.Contains("randomMpeUl", error.Reason, StringComparison.Ordinal);
    }
}
