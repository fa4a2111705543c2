namespace GelDispense.Agent.Configuration;

/// <summary>Stability and drift settings as written in the config file (seconds and grams).</summary>
public sealed record StabilityConfig
{
    /// <summary>auto (balance flag when sent, else software), flag, or software.</summary>
    public string Mode { get; init; } = "auto";

    public int MinReadings { get; init; } = 5;

    public double BandG { get; init; } = 0.0005;

    public double WindowS { get; init; } = 1.0;

    public double DriftWindowS { get; init; } = 20;

    public double DriftThresholdGPerMin { get; init; } = 0.002;
}
