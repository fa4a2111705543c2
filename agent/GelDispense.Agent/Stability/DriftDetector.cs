namespace GelDispense.Agent.Stability;

/// <summary>
/// Least-squares slope of mass against time over the drift window. A slow steady loss (solvent evaporating
/// from an open vessel) can sit inside the stability band for seconds while the reading walks away from the
/// true addition, so it is reported on its own. Jumps (pours, tares) restart the window.
/// </summary>
internal sealed class DriftDetector(StabilitySettings settings)
{
    private readonly Queue<(DateTimeOffset At, double ValueG)> _recent = new();
    private DateTimeOffset? _since;
    private double _lastG;

    public DriftEstimate? Add(DateTimeOffset at, double valueG)
    {
        if (_recent.Count > 0 && Math.Abs(valueG - _lastG) > settings.DriftJumpG)
        {
            Reset();
        }

        _since ??= at;
        _lastG = valueG;
        _recent.Enqueue((at, valueG));
        while (at - _recent.Peek().At > settings.DriftWindow)
        {
            _recent.Dequeue();
        }

        // A slope over a fraction of the window is mostly noise; say nothing until the window is covered.
        return at - _since.Value < settings.DriftWindow || _recent.Count < 3 ? null : Fit(at);
    }

    public void Reset()
    {
        _recent.Clear();
        _since = null;
    }

    private DriftEstimate Fit(DateTimeOffset now)
    {
        double n = _recent.Count, sumT = 0, sumM = 0;
        foreach (var (at, value) in _recent)
        {
            sumT += (at - now).TotalMinutes;
            sumM += value;
        }

        double meanT = sumT / n, meanM = sumM / n, stt = 0, stm = 0, smm = 0;
        foreach (var (at, value) in _recent)
        {
            var dt = (at - now).TotalMinutes - meanT;
            var dm = value - meanM;
            stt += dt * dt;
            stm += dt * dm;
            smm += dm * dm;
        }

        var slope = stt > 0 ? stm / stt : 0;
        var rSquared = stt > 0 && smm > 0 ? stm * stm / (stt * smm) : 0;
        var drifting = Math.Abs(slope) >= settings.DriftThresholdGPerMin && rSquared >= settings.DriftMinRSquared;
        return new DriftEstimate(slope, rSquared, (int)n, drifting);
    }
}
