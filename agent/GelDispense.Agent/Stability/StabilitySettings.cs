namespace GelDispense.Agent.Stability;

/// <summary>
/// Software stability: at least <see cref="MinReadings"/> readings inside a band of <see cref="BandG"/>
/// (max − min) over the last <see cref="Window"/>, and the series observed for the whole window.
/// Drift: a least-squares slope over <see cref="DriftWindow"/> steeper than <see cref="DriftThresholdGPerMin"/>
/// that explains at least <see cref="DriftMinRSquared"/> of the variance, i.e. a steady trend, not noise.
/// A step larger than <see cref="DriftJumpG"/> between readings (a pour, a tare) restarts the drift window.
/// </summary>
public sealed record StabilitySettings
{
    public StabilityMode Mode { get; init; } = StabilityMode.Auto;

    public int MinReadings { get; init; } = 5;

    public double BandG { get; init; } = 0.0005;

    public TimeSpan Window { get; init; } = TimeSpan.FromSeconds(1);

    public TimeSpan DriftWindow { get; init; } = TimeSpan.FromSeconds(20);

    public double DriftThresholdGPerMin { get; init; } = 0.002;

    public double DriftMinRSquared { get; init; } = 0.8;

    public double DriftJumpG { get; init; } = 0.05;
}
