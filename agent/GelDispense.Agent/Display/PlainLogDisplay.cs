using System.Globalization;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Display;

/// <summary>
/// Plain log lines for when stdout is not a terminal (the demo in CI, a run piped to a file): every note as it
/// happens, and the live state at most every <c>readingInterval</c> or when the step or its phase changes.
/// </summary>
public sealed class PlainLogDisplay(TextWriter output, TimeProvider time, TimeSpan readingInterval) : IStationDisplay
{
    private DateTimeOffset _lastShown = DateTimeOffset.MinValue;
    private (int Step, Sequencing.StepPhase Phase) _lastState = (-2, default);

    public void Show(StationView view)
    {
        var now = time.GetUtcNow();
        var state = (view.StepIndex, view.Phase);
        if (state == _lastState && now - _lastShown < readingInterval)
        {
            return;
        }

        _lastState = state;
        _lastShown = now;
        Write(Describe(view));
    }

    public void Note(NoteKind kind, string text) => Write(kind switch
    {
        NoteKind.Alert => "!! " + text,
        NoteKind.Warning => "!  " + text,
        NoteKind.Good => "ok " + text,
        _ => "-- " + text,
    });

    public void Finish(AsMade asMade, string recipeName, string origin)
    {
        foreach (var line in AsMadeSummary.From(asMade, recipeName, origin).Lines())
        {
            output.WriteLine(line);
        }

        output.Flush();
    }

    public ValueTask DisposeAsync()
    {
        output.Flush();
        return ValueTask.CompletedTask;
    }

    /// <summary>One line of live state, shared with tests and the live display's fallback.</summary>
    public static string Describe(StationView v)
    {
        if (v.StepIndex < 0)
        {
            return $"batch {v.BatchId}: no open step; balance {v.BalanceStatus}, service {v.ServiceStatus}";
        }

        var d = v.ReadabilityG;
        var drift = v.DriftGPerMin is { } slope ? $", DRIFT {Grams.Signed(slope * 1000, 1)} mg/min" : "";
        var volume = v.VolumeToDeliverMl is { } ml
            ? string.Create(CultureInfo.InvariantCulture, $" deliver {ml * 1000:0} µL (now {v.LiveVolumeMl * 1000 ?? 0:0} µL)")
            : "";
        var bar = v.LowNetG is { } low && v.HighNetG is { } high ? TargetBar.Render(v.LiveNetG, low, high, 24) : "";
        var pending = v.PendingAdditions > 0 ? $", {v.PendingAdditions} pending" : "";
        return $"step {v.StepNumber}/{v.StepCount} {v.ReagentId} {v.Phase.ToString().ToLowerInvariant()}: net {Grams.Text(v.LiveNetG, d)} of {Grams.Text(v.TargetNetG, d)} " +
            $"[{Grams.Text(v.LowNetG, d)} .. {Grams.Text(v.HighNetG, d)}]{volume} {bar} {v.ReadingState}{drift}; " +
            $"balance {v.BalanceStatus}, service {v.ServiceStatus}{pending}; {v.Hint}";
    }

    private void Write(string text)
    {
        var at = time.GetLocalNow().ToString("HH:mm:ss.fff", CultureInfo.InvariantCulture);
        output.WriteLine($"{at}  {text}");
        output.Flush();
    }
}
