namespace GelDispense.Agent.Sequencing;

/// <summary>
/// Settings of the per-step state machine. <see cref="ZeroBandG"/> is how close to zero a reading must be to count as
/// tared; <see cref="TareResend"/> repeats a tare command that the balance seems not to have taken.
/// </summary>
public sealed record StepMachineSettings
{
    public ConfirmMode Mode { get; init; } = ConfirmMode.Auto;

    public TareMode Tare { get; init; } = TareMode.Running;

    public double ZeroBandG { get; init; } = 0.001;

    public TimeSpan TareResend { get; init; } = TimeSpan.FromSeconds(3);
}
