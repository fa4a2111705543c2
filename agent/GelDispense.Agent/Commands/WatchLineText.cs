using System.Globalization;
using GelDispense.Agent.Formats;
using GelDispense.Agent.Readings;
using GelDispense.Agent.Stability;

namespace GelDispense.Agent.Commands;

/// <summary>One watch line: time, the raw text as received, and what we made of it.</summary>
internal static class WatchLineText
{
    public static string Format(ReadingEvent e)
    {
        var raw = e.Line.Line.NonTextBytes > 0 ? $"{e.Line.Line.Text} [+{e.Line.Line.NonTextBytes} noise bytes]" : e.Line.Line.Text;
        var time = e.Line.ReceivedAt.ToLocalTime().ToString("HH:mm:ss.fff", CultureInfo.InvariantCulture);
        return $"{time}  {Quote(raw),-34}  {Meaning(e)}";
    }

    private static string Meaning(ReadingEvent e)
    {
        if (e.Parse.Failure is { } failure)
        {
            return $"ignored ({failure.Reason}: {failure.Detail})";
        }

        var verdict = e.Verdict!;
        var reading = verdict.Reading;
        if (reading.Kind != ReadingKind.Weight)
        {
            return $"{reading.Kind.ToString().ToUpperInvariant()}: no usable mass";
        }

        var basis = verdict.Basis == StabilityBasis.BalanceFlag ? "balance flag" : "software";
        var state = verdict.IsStable ? $"stable ({basis})" : $"moving ({basis})";
        var drift = verdict.Drifting
            ? string.Create(CultureInfo.InvariantCulture, $"  DRIFT {verdict.Drift!.SlopeGPerMin * 1000:+0.0;-0.0} mg/min")
            : "";
        return string.Create(CultureInfo.InvariantCulture, $"{reading.ValueG,12:0.0000####} g  {state}{drift}");
    }

    private static string Quote(string raw) => $"\"{raw}\"";
}
