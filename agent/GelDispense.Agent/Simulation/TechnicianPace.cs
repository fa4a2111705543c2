namespace GelDispense.Agent.Simulation;

/// <summary>How quickly a simulated technician works.</summary>
public sealed record TechnicianPace
{
    public TimeSpan PauseBetweenSteps { get; init; } = TimeSpan.FromSeconds(3);

    public double FastGPerS { get; init; } = 2.0;

    public double SlowGPerS { get; init; } = 0.2;
}
