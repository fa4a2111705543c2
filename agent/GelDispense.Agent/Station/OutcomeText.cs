using System.Globalization;
using GelDispense.Agent.Sequencing;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Station;

/// <summary>The words for a step starting and for an addition's outcome, including what a re-plan changed.</summary>
public static class OutcomeText
{
    public static string StepStart(PlanStep step, StepWindow window, int number, int count, string lotId, double readabilityG)
    {
        var how = window.ByVolume
            ? F($"deliver {step.TargetVolumeMl * 1000:0} µL by pipette, then the balance checks it: ")
            : "weigh in ";
        var lot = lotId.Length > 0 ? $", lot {lotId}" : "";
        return $"step {number}/{count}: {step.ReagentId}{lot}: {how}{Display.Grams.Text(window.TargetReadingG, readabilityG)} " +
            $"(window {Display.Grams.Text(window.LowReadingG, readabilityG)} .. {Display.Grams.Text(window.HighReadingG, readabilityG)})";
    }

    public static string Confirmed(PlanStep step, StepWindow window, ConfirmDecision decision, double readabilityG)
    {
        var net = decision.NetReadingG!.Value;
        var volume = window.VolumeMl(net) is { } ml
            ? F($"; delivered {ml * 1000:0} µL against {step.TargetVolumeMl * 1000:0} µL (ρ {window.DensityGPerMl:0.0000} g/mL)")
            : "";
        return $"step {step.Index + 1} {step.ReagentId}: confirmed {Display.Grams.Text(net, readabilityG)} ({decision.Reason}){volume}; journaled";
    }

    /// <summary>One line per remaining step whose target moved: old and new reading, and the new window.</summary>
    public static IEnumerable<string> Replanned(IReadOnlyDictionary<int, PlanStep> before, IEnumerable<PlanStep> after, double readabilityG)
    {
        foreach (var step in after)
        {
            var was = before.TryGetValue(step.Index, out var old) ? Display.Grams.Text(old.TargetReadingG, readabilityG) : "—";
            var window = StepWindow.For(step);
            yield return $"   step {step.Index + 1} {step.ReagentId}: {was} -> {Display.Grams.Text(step.TargetReadingG, readabilityG)} " +
                $"(window {Display.Grams.Text(window.LowReadingG, readabilityG)} .. {Display.Grams.Text(window.HighReadingG, readabilityG)})";
        }
    }

    public static string Predicted(Composition? predicted, bool? withinSpec, double? scaleFactor)
    {
        if (predicted is null)
        {
            return "predicted final composition unavailable";
        }

        var spec = withinSpec is { } w ? (w ? ", within spec" : ", OUTSIDE spec") : "";
        var factor = scaleFactor is { } k && k > 0 ? F($", batch factor {k:0.000}") : "";
        return F($"predicted final: R {predicted.HydrolysisRatio:0.000}, oxide density {predicted.OxideDensityGPerMl:0.0000} g/mL, gel volume {predicted.GelVolumeMl:0.0} mL{factor}{spec}");
    }

    private static string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
