using GelDispense.Agent.Display;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Simulation;

namespace GelDispense.Agent.Demo;

/// <summary>
/// A simulated technician who works from the station's screen, as a person does: when a new step shows "adding",
/// they wait a moment, pour toward the target shown (fast, then slowly near the end), stop, and wait for the next
/// step. Because they read the target from the screen, they follow a re-plan. Steps listed in the over-pour table
/// are over-poured by that fraction; pipette steps are delivered in one quick stroke. Reads the screen from the
/// simulator's thread, which is safe because each <see cref="StationView"/> is immutable.
/// </summary>
public sealed class FollowingTechnician(Func<StationView?> screen, IReadOnlyDictionary<int, double> overPourByStep, TechnicianPace pace, TimeSpan reaction) : ITechnician
{
    private int _doneStep = -1;
    private double _aimG;
    private double _pouredG;
    private bool _pouring;
    private bool _byVolume;
    private TimeSpan _waited;

    public int StepIndex { get; private set; } = -1;

    public bool Finished => _doneStep >= 0 && screen() is { StepIndex: < 0 };

    public double Pour(TimeSpan dt)
    {
        if (!_pouring && !TryStart(dt))
        {
            return 0;
        }

        var rate = _byVolume || _pouredG < 0.85 * _aimG ? pace.FastGPerS : pace.SlowGPerS;
        var amount = Math.Min(rate * dt.TotalSeconds, _aimG - _pouredG);
        _pouredG += amount;
        if (_pouredG >= _aimG - 1e-12)
        {
            _pouring = false;
            _doneStep = StepIndex;
            _waited = TimeSpan.Zero;
        }

        return amount;
    }

    private bool TryStart(TimeSpan dt)
    {
        var view = screen();
        if (view is not { Phase: StepPhase.Adding, StepIndex: >= 0, TargetNetG: { } targetG } || (view.StepIndex == _doneStep && !ShortOfWindow(view)))
        {
            _waited = TimeSpan.Zero;
            return false;
        }

        _waited += dt;
        if (_waited < reaction)
        {
            return false;
        }

        StepIndex = view.StepIndex;
        _byVolume = view.VolumeToDeliverMl is not null;
        var overPour = view.StepIndex == _doneStep ? 0 : overPourByStep.GetValueOrDefault(view.StepIndex);
        _aimG = Math.Max(0, (targetG * (1 + overPour)) - Math.Max(0, view.LiveNetG ?? 0));
        _pouredG = 0;
        _pouring = true;
        return true;
    }

    private static bool ShortOfWindow(StationView view) =>
        view is { ReadingState: "stable", VolumeToDeliverMl: null, LiveNetG: { } net, LowNetG: { } low } && net < low;
}
