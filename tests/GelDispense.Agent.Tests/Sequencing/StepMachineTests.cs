using GelDispense.Agent.Formats;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Stability;
using Microsoft.Extensions.Time.Testing;

namespace GelDispense.Agent.Tests.Sequencing;

public sealed class StepMachineTests
{
    private static readonly StepWindow Window = new(2, TargetReadingG: 4, LowReadingG: 3.95, HighReadingG: 4.05, TrueGPerReadingG: 1, MlPerReadingG: null);

    private readonly FakeTimeProvider _time = new();

    private static StabilityVerdict Stable(double grossG) => new(new BalanceReading(grossG, true, ReadingKind.Weight, ""), true, StabilityBasis.BalanceFlag, null);

    private static StabilityVerdict Moving(double grossG) => new(new BalanceReading(grossG, false, ReadingKind.Weight, ""), false, StabilityBasis.BalanceFlag, null);

    [Fact]
    public void With_a_tare_command_a_step_starts_by_taring_and_adds_only_once_the_balance_shows_zero()
    {
        var machine = new StepMachine(new StepMachineSettings { Tare = TareMode.BalanceTare, ZeroBandG = 0.002 });

        Assert.Equal(MachineActionKind.SendTare, machine.Begin(Window, _time.GetUtcNow()).Kind);
        machine.OnReading(Stable(57.3), true, false, _time.GetUtcNow());
        Assert.Equal(StepPhase.Zeroing, machine.Phase);

        machine.OnReading(Stable(0.001), true, false, _time.GetUtcNow());
        Assert.Equal(StepPhase.Adding, machine.Phase);
        Assert.Equal(0.001, machine.BaselineG);
    }

    [Fact]
    public void A_tare_the_balance_has_not_shown_is_sent_again_after_the_resend_time()
    {
        var machine = new StepMachine(new StepMachineSettings { Tare = TareMode.BalanceTare, TareResend = TimeSpan.FromSeconds(3) });
        machine.Begin(Window, _time.GetUtcNow());

        _time.Advance(TimeSpan.FromSeconds(2));
        Assert.Equal(MachineActionKind.None, machine.OnTick(_time.GetUtcNow()).Kind);
        _time.Advance(TimeSpan.FromSeconds(1.5));
        Assert.Equal(MachineActionKind.SendTare, machine.OnTick(_time.GetUtcNow()).Kind);
    }

    [Fact]
    public void A_tare_is_sent_again_when_the_balance_link_comes_back_during_zeroing()
    {
        var machine = new StepMachine(new StepMachineSettings { Tare = TareMode.BalanceTare });
        machine.Begin(Window, _time.GetUtcNow());

        Assert.Equal(MachineActionKind.SendTare, machine.OnLinkUp(_time.GetUtcNow()).Kind);
    }

    [Fact]
    public void Without_a_tare_command_the_next_step_counts_from_what_the_pan_held_at_the_last_confirmation()
    {
        var machine = new StepMachine(new StepMachineSettings { Tare = TareMode.Running });
        machine.Begin(Window, _time.GetUtcNow());
        machine.OnReading(Stable(20.0), true, false, _time.GetUtcNow());
        var confirm = machine.OnReading(Stable(24.0), true, false, _time.GetUtcNow());
        Assert.Equal(MachineActionKind.Confirm, confirm.Kind);
        Assert.Equal(4.0, confirm.Decision!.NetReadingG!.Value, 12);

        machine.Recorded(confirm.GrossG);
        Assert.Equal(MachineActionKind.None, machine.Begin(Window with { StepIndex = 3 }, _time.GetUtcNow()).Kind);
        Assert.Equal(StepPhase.Adding, machine.Phase);
        Assert.Equal(24.0, machine.BaselineG);
    }

    [Fact]
    public void Once_confirmed_the_machine_ignores_readings_until_the_addition_is_recorded()
    {
        var machine = new StepMachine(new StepMachineSettings());
        machine.Begin(Window, _time.GetUtcNow());
        machine.OnReading(Stable(0), true, false, _time.GetUtcNow());
        Assert.Equal(MachineActionKind.None, machine.OnReading(Moving(4.0), true, false, _time.GetUtcNow()).Kind);
        Assert.Equal(MachineActionKind.Confirm, machine.OnReading(Stable(4.0), true, false, _time.GetUtcNow()).Kind);

        Assert.Equal(StepPhase.Recording, machine.Phase);
        Assert.Equal(MachineActionKind.None, machine.OnReading(Stable(4.0), true, false, _time.GetUtcNow()).Kind);
    }

    [Fact]
    public void A_confirmation_the_journal_refused_goes_back_to_adding_the_same_step()
    {
        var machine = new StepMachine(new StepMachineSettings());
        machine.Begin(Window, _time.GetUtcNow());
        machine.OnReading(Stable(0), true, false, _time.GetUtcNow());
        machine.OnReading(Stable(4.0), true, false, _time.GetUtcNow());

        machine.ConfirmationFailed("disk full");

        Assert.Equal(StepPhase.Adding, machine.Phase);
        Assert.Equal(MachineActionKind.Confirm, machine.OnReading(Stable(4.0), true, false, _time.GetUtcNow()).Kind);
    }

    [Fact]
    public void A_retarget_keeps_the_steps_zero_and_moves_the_window()
    {
        var machine = new StepMachine(new StepMachineSettings());
        machine.Begin(Window, _time.GetUtcNow());
        machine.OnReading(Stable(1.0), true, false, _time.GetUtcNow());

        machine.Retarget(Window with { TargetReadingG = 4.2, LowReadingG = 4.15, HighReadingG = 4.25 });

        Assert.Equal(1.0, machine.BaselineG);
        Assert.Equal(MachineActionKind.None, machine.OnReading(Stable(5.0), true, false, _time.GetUtcNow()).Kind);
        Assert.Equal(MachineActionKind.Confirm, machine.OnReading(Stable(5.2), true, false, _time.GetUtcNow()).Kind);
    }
}
