namespace GelDispense.Agent.Simulation;

/// <summary>
/// Pours a fixed list of additions: waits, pours fast to 85 % of the aim, then slowly to the aim, as people do
/// with a wash bottle or a pipette near the end. The aim includes the step's over-pour, so an over-pour in the
/// script is an over-pour on the pan.
/// </summary>
public sealed class ScriptedTechnician(IReadOnlyList<PourStep> steps, TechnicianPace pace) : ITechnician
{
    private TimeSpan _waited;
    private double _pouredInStepG;

    public int StepIndex { get; private set; }

    public bool Finished => StepIndex >= steps.Count;

    public double Pour(TimeSpan dt)
    {
        if (Finished)
        {
            return 0;
        }

        if (_waited < pace.PauseBetweenSteps)
        {
            _waited += dt;
            return 0;
        }

        var aim = steps[StepIndex].AimG;
        var rate = _pouredInStepG < 0.85 * aim ? pace.FastGPerS : pace.SlowGPerS;
        var amount = Math.Min(rate * dt.TotalSeconds, aim - _pouredInStepG);
        _pouredInStepG += amount;
        if (_pouredInStepG >= aim - 1e-12)
        {
            StepIndex++;
            _waited = TimeSpan.Zero;
            _pouredInStepG = 0;
        }

        return amount;
    }
}
