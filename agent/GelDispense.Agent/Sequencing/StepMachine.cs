using GelDispense.Agent.Stability;

namespace GelDispense.Agent.Sequencing;

/// <summary>
/// One step at a time, as pure logic: find the step's zero, watch the readings through <see cref="ConfirmRule"/>,
/// and say when to confirm. It does no I/O; the edge sends the tare command, journals and sends what it confirms,
/// and calls <see cref="Recorded"/> when the addition has an outcome. Time comes in with each input.
/// </summary>
public sealed class StepMachine(StepMachineSettings settings)
{
    private DateTimeOffset _tareSentAt;

    public StepPhase Phase { get; private set; } = StepPhase.Zeroing;

    public StepWindow? Window { get; private set; }

    /// <summary>The gross reading the step counts from; null until found.</summary>
    public double? BaselineG { get; private set; }

    /// <summary>The gross reading of the last recorded addition: what is on the pan now.</summary>
    public double? LastGrossG { get; private set; }

    public string Reason { get; private set; } = "";

    public StepMachineSettings Settings => settings;

    /// <summary>Starts a step. With a running tare the step counts from what the pan held at the last confirmation.</summary>
    public MachineAction Begin(StepWindow window, DateTimeOffset now)
    {
        Window = window;
        BaselineG = null;
        Phase = StepPhase.Zeroing;
        if (settings.Tare == TareMode.BalanceTare)
        {
            _tareSentAt = now;
            Reason = "taring: wait for zero";
            return MachineAction.SendTare;
        }

        if (LastGrossG is { } gross)
        {
            StartAdding(gross);
        }
        else
        {
            Reason = "waiting for a stable reading to start from";
        }

        return MachineAction.None;
    }

    public MachineAction OnReading(StabilityVerdict? verdict, bool linkConnected, bool keyPressed, DateTimeOffset now)
    {
        if (Window is not { } window)
        {
            return MachineAction.None;
        }

        return Phase switch
        {
            StepPhase.Zeroing => Zeroing(verdict, linkConnected, now),
            StepPhase.Adding => Adding(verdict, linkConnected, keyPressed, window),
            _ => MachineAction.None,
        };
    }

    /// <summary>Time passes without a reading: repeats a tare the balance has not shown yet.</summary>
    public MachineAction OnTick(DateTimeOffset now)
    {
        if (Phase != StepPhase.Zeroing || Window is null || settings.Tare != TareMode.BalanceTare || now - _tareSentAt < settings.TareResend)
        {
            return MachineAction.None;
        }

        _tareSentAt = now;
        Reason = "no zero yet: tare sent again (tare by hand if the balance ignores it)";
        return MachineAction.SendTare;
    }

    /// <summary>The balance link came (back) up: a tare sent while it was down never arrived, so send it now.</summary>
    public MachineAction OnLinkUp(DateTimeOffset now)
    {
        if (Phase != StepPhase.Zeroing || Window is null || settings.Tare != TareMode.BalanceTare)
        {
            return MachineAction.None;
        }

        _tareSentAt = now;
        return MachineAction.SendTare;
    }

    /// <summary>The service re-planned the open step (after a replay): same step and zero, new target and window.</summary>
    public void Retarget(StepWindow window)
    {
        if (Window?.StepIndex == window.StepIndex && Phase != StepPhase.Recording)
        {
            Window = window;
        }
    }

    /// <summary>The addition has an outcome; the pan now holds <paramref name="grossG"/>.</summary>
    public void Recorded(double grossG)
    {
        LastGrossG = grossG;
        Window = null;
        Phase = StepPhase.Zeroing;
    }

    /// <summary>The edge could not journal the confirmation (e.g. disk full); go back to watching the same step.</summary>
    public void ConfirmationFailed(string reason)
    {
        Phase = StepPhase.Adding;
        Reason = reason;
    }

    private MachineAction Zeroing(StabilityVerdict? verdict, bool linkConnected, DateTimeOffset now)
    {
        var settled = linkConnected && verdict is { Confirmable: true };
        if (settings.Tare == TareMode.Running)
        {
            if (settled)
            {
                StartAdding(verdict!.Reading.ValueG!.Value);
            }

            return MachineAction.None;
        }

        if (settled && Math.Abs(verdict!.Reading.ValueG!.Value) <= settings.ZeroBandG)
        {
            StartAdding(verdict.Reading.ValueG.Value);
            return MachineAction.None;
        }

        return OnTick(now);
    }

    private MachineAction Adding(StabilityVerdict? verdict, bool linkConnected, bool keyPressed, StepWindow window)
    {
        var decision = ConfirmRule.Decide(verdict, linkConnected, window, BaselineG!.Value, settings.Mode, keyPressed);
        Reason = decision.Reason;
        if (!decision.Confirm)
        {
            return MachineAction.None;
        }

        Phase = StepPhase.Recording;
        return new MachineAction(MachineActionKind.Confirm, decision, verdict!.Reading.ValueG!.Value);
    }

    private void StartAdding(double baselineG)
    {
        BaselineG = baselineG;
        Phase = StepPhase.Adding;
        Reason = "add the reagent";
    }
}
