using System.Globalization;
using GelDispense.Chemistry.Reagents;

namespace GelDispense.Chemistry.Planning;

/// <summary>What would make an infeasible step feasible, in plain words with the numbers a technician needs.</summary>
internal static class StepAdvice
{
    private const double WaterMolarMassGPerMol = 18.015;

    public static IReadOnlyList<string> For(PlanDraft draft, int line, PlanRequest request, double? minimumBatchScale)
    {
        if (draft.StepFeasible(line))
        {
            return [];
        }

        var f = draft.Formulation;
        var l = f.Lines[line];
        var massG = f.MassesG[line];
        var windowG = draft.WindowsG[line];
        var errorG = draft.Devices[line].ErrorG;
        var advice = new List<string>();
        var liquid = !l.Reagent.Definition.IsSolid;
        if (liquid && request.Pipette is null && windowG > 0)
        {
            advice.Add($"A pipette or dispenser whose expected error at {F(massG * l.VolumeMlPerG * 1000)} µL is below ±{F(windowG * l.VolumeMlPerG * 1000)} µL would hold this step.");
        }

        if (minimumBatchScale is { } k && k > 1)
        {
            advice.Add($"A batch {F(k)} times as large makes every step feasible on this balance.");
        }

        if (l.Reagent.Definition.Role == ReagentRole.Catalyst && liquid && windowG > 0 && double.IsFinite(errorG))
        {
            var dilution = Math.Ceiling(errorG / windowG * 1.1 * 10) / 10;
            var strengthPct = l.Reagent.Definition.AssayPct / dilution;
            var precursorMol = f.Totals().PrecursorMol;
            var addedR = (dilution - 1) * massG / WaterMolarMassGPerMol / precursorMol;
            advice.Add($"Dilute '{l.ReagentId}' {F(dilution)}-fold with water to {F(strengthPct)} % and add {F(massG * dilution)} g; the extra water raises R by {F(addedR)}, so re-solve the recipe with the diluted solution.");
        }

        return advice;
    }

    public static string? Problem(PlanDraft draft, int line)
    {
        if (draft.StepFeasible(line))
        {
            return null;
        }

        var device = draft.Devices[line];
        if (!device.Usable)
        {
            return device.Problem;
        }

        return draft.WindowsG[line] <= 0
            ? "the spec leaves no tolerance for this step: the nominal composition already uses the whole budget"
            : $"the {(device.Method == DispensingMethod.Balance ? "balance" : "pipette")}'s expected error ±{F(device.ErrorG)} g exceeds the window ±{F(draft.WindowsG[line])} g";
    }

    private static string F(double v) => v.ToString(v >= 100 ? "0.#" : v >= 1 ? "0.###" : "0.#####", CultureInfo.InvariantCulture);
}
