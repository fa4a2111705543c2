using GelDispense.Agent.Formats;

namespace GelDispense.Agent.Stability;

/// <summary>
/// Judges each reading as it arrives, stamping it with the injected clock. An overload, underload or error
/// reading is never stable and restarts the software window, so the first mass after it must earn stability
/// again. Call <see cref="Reset"/> after a reconnect: readings from before a hang-up say nothing about now.
/// </summary>
public sealed class StabilityDetector(StabilitySettings settings, TimeProvider time)
{
    private readonly SoftwareStability _software = new(settings);
    private readonly DriftDetector _drift = new(settings);

    public StabilityVerdict Add(BalanceReading reading)
    {
        if (reading.Kind != ReadingKind.Weight || reading.ValueG is not { } valueG)
        {
            Reset();
            return new StabilityVerdict(reading, false, StabilityBasis.NoMass, null);
        }

        var now = time.GetUtcNow();
        var softwareStable = _software.Add(now, valueG);
        var drift = _drift.Add(now, valueG);
        return settings.Mode switch
        {
            StabilityMode.Software => new StabilityVerdict(reading, softwareStable, StabilityBasis.Software, drift),
            StabilityMode.BalanceFlag => new StabilityVerdict(reading, reading.Stable == true, StabilityBasis.BalanceFlag, drift),
            _ when reading.Stable is { } flag => new StabilityVerdict(reading, flag, StabilityBasis.BalanceFlag, drift),
            _ => new StabilityVerdict(reading, softwareStable, StabilityBasis.Software, drift),
        };
    }

    public void Reset()
    {
        _software.Reset();
        _drift.Reset();
    }
}
