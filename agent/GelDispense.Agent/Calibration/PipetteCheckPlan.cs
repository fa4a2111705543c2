using GelDispense.Chemistry.Metrology;

namespace GelDispense.Agent.Calibration;

/// <summary>
/// A guided gravimetric check: <see cref="Count"/> deliveries of water at <see cref="SelectedVolumeUl"/> µL, weighed on
/// the station's balance in the stated room conditions (water and air at one temperature, as the ISO 8655-6 Z table
/// assumes). The tare command, when the balance has one, zeroes the balance before each delivery.
/// </summary>
public sealed record PipetteCheckPlan(
    PipetteProfile Pipette,
    double SelectedVolumeUl,
    int Count,
    double TemperatureC,
    double PressureHpa,
    double RelativeHumidityPct,
    string? TareCommand,
    double ReadabilityG)
{
    /// <summary>What the balance should show for one delivery: V / Z, in g (Z in µL/mg from ISO 8655-6).</summary>
    public double ExpectedReadingG => SelectedVolumeUl / ZFactor.MicrolitresPerMilligram(TemperatureC, PressureHpa, RelativeHumidityPct) / 1000;
}
