namespace GelDispense.Agent.Simulation;

/// <summary>One addition a simulated technician makes: the intended mass and how far past it the pour goes
/// (0.1 = ten percent too much; negative for a short pour).</summary>
public sealed record PourStep(double TargetG, double OverPourFraction = 0)
{
    public double AimG => TargetG * (1 + OverPourFraction);
}
