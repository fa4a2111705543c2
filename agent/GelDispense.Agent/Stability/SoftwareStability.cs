namespace GelDispense.Agent.Stability;

/// <summary>
/// "N readings inside a band over a time window". The window must be fully observed since the last reset:
/// five quick readings right after a pour are not enough when the window asks for one second.
/// </summary>
internal sealed class SoftwareStability(StabilitySettings settings)
{
    private readonly Queue<(DateTimeOffset At, double ValueG)> _recent = new();
    private DateTimeOffset? _since;

    public bool Add(DateTimeOffset at, double valueG)
    {
        _since ??= at;
        _recent.Enqueue((at, valueG));
        while (_recent.Count > 0 && at - _recent.Peek().At > settings.Window)
        {
            _recent.Dequeue();
        }

        if (_recent.Count < settings.MinReadings || at - _since.Value < settings.Window)
        {
            return false;
        }

        var min = double.MaxValue;
        var max = double.MinValue;
        foreach (var (_, value) in _recent)
        {
            min = Math.Min(min, value);
            max = Math.Max(max, value);
        }

        return max - min <= settings.BandG;
    }

    public void Reset()
    {
        _recent.Clear();
        _since = null;
    }
}
