namespace GelDispense.Agent.Simulation;

/// <summary>
/// The simulated balance. Noise is Gaussian with a standard deviation of <see cref="NoiseInReadabilities"/>
/// times the readability d (a good analytical balance repeats to about one d, common practice); the display
/// follows the load as a first-order lag with time constant <see cref="SettlingTimeConstant"/>; an open vessel
/// loses <see cref="EvaporationGPerMin"/> while it holds liquid.
/// </summary>
public sealed record SimulatorSettings
{
    public double ReadabilityG { get; init; } = 0.0001;

    public double CapacityG { get; init; } = 220;

    public double NoiseInReadabilities { get; init; } = 0.5;

    public TimeSpan SettlingTimeConstant { get; init; } = TimeSpan.FromMilliseconds(600);

    public double EvaporationGPerMin { get; init; }

    public TimeSpan SampleInterval { get; init; } = TimeSpan.FromMilliseconds(100);

    /// <summary>Chance per line that noise bytes are spliced into it (a bad cable, a baud mismatch).</summary>
    public double GarbageProbability { get; init; }

    /// <summary>When set, the line is cut this often and stays down for <see cref="DisconnectFor"/>.</summary>
    public TimeSpan? DisconnectEvery { get; init; }

    public TimeSpan DisconnectFor { get; init; } = TimeSpan.FromSeconds(1);

    /// <summary>Command texts the simulated balance answers; none by default, as for the agent.</summary>
    public string? TareCommand { get; init; }

    public string? ZeroCommand { get; init; }
}
