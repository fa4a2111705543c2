using GelDispense.Agent.Sequencing;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Tests.Sequencing;

public sealed class StepWindowTests
{
    // Buoyancy factor m/W for water against 8000 kg/m³ weights at ρa = 1.2 kg/m³: 1.001053
    // (OIML R 111 / NIST SOP 2 form; calculated value, status C in published-values.md §4).
    private const double WaterTruePerReading = 1.001053;

    [Fact]
    public void The_band_on_the_true_mass_becomes_a_band_on_the_reading_through_the_buoyancy_factor()
    {
        var step = new PlanStep { Index = 3, TargetMassG = 10, AcceptanceG = 0.05, TargetReadingG = 10 / WaterTruePerReading };

        var window = StepWindow.For(step);

        Assert.Equal(9.95 / WaterTruePerReading, window.LowReadingG, 9);
        Assert.Equal(10.05 / WaterTruePerReading, window.HighReadingG, 9);
        Assert.Equal(10.0, window.TrueMassG(window.TargetReadingG), 9);
    }

    [Theory]
    [InlineData(9.93, WindowPosition.Below)]
    [InlineData(9.95, WindowPosition.Inside)]
    [InlineData(10.03, WindowPosition.Inside)]
    [InlineData(10.04, WindowPosition.Above)]
    public void A_net_reading_is_placed_below_inside_or_above_the_band(double netReadingG, WindowPosition expected)
    {
        var window = StepWindow.For(new PlanStep { TargetMassG = 10, AcceptanceG = 0.05, TargetReadingG = 10 / WaterTruePerReading });

        Assert.Equal(expected, window.Position(netReadingG));
    }

    [Fact]
    public void A_pipette_step_turns_the_balance_delta_into_the_volume_delivered_at_the_reagents_density()
    {
        // Water at 20 °C: 0.998207 g/mL (Tanaka et al., Metrologia 38 (2001) 301; status V in published-values.md §5).
        const double densityGPerMl = 0.998207;
        var step = new PlanStep { TargetMassG = densityGPerMl, TargetVolumeMl = 1.0, AcceptanceG = 0.005, TargetReadingG = densityGPerMl / WaterTruePerReading };

        var window = StepWindow.For(step);

        Assert.True(window.ByVolume);
        Assert.Equal(densityGPerMl, window.DensityGPerMl!.Value, 9);
        Assert.Equal(1.0, window.VolumeMl(window.TargetReadingG)!.Value, 9);
        Assert.Equal(0.5, window.VolumeMl(window.TargetReadingG / 2)!.Value, 9);
    }

    [Fact]
    public void A_balance_step_has_no_volume_to_check()
    {
        var window = StepWindow.For(new PlanStep { TargetMassG = 5, AcceptanceG = 0.1, TargetReadingG = 4.99 });

        Assert.False(window.ByVolume);
        Assert.Null(window.VolumeMl(4.99));
    }
}
