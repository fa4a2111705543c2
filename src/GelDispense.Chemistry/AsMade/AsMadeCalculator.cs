using System.Globalization;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Metrology;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Tolerances;

namespace GelDispense.Chemistry.AsMade;

/// <summary>
/// Recomputes the composition from the readings (buoyancy-corrected to true mass in the plan's air) and
/// compares it with the nominal plan: R and the oxide density against the spec tolerances, every
/// component's mole ratio against its own (spec or step-limit) tolerance.
/// </summary>
public static class AsMadeCalculator
{
    public static AsMadeReport Compute(DispensingPlan plan, IReadOnlyList<RecordedReading> readings, PlanOptions? options = null)
    {
        options ??= new PlanOptions();
        var f = plan.Formulation;
        var actual = new double[f.Lines.Count];
        var shown = new double[plan.Steps.Count];
        foreach (var r in readings)
        {
            if (r.StepIndex < 0 || r.StepIndex >= plan.Steps.Count)
            {
                throw new InvalidInputException("stepIndex", r.StepIndex.ToString(CultureInfo.InvariantCulture), $"the plan has steps 0 to {plan.Steps.Count - 1}");
            }

            var step = plan.Steps[r.StepIndex];
            actual[step.ComponentIndex] += Buoyancy.TrueMassFromReadingG(r.ReadingG, step.DensityGPerMl, plan.AirDensityKgPerM3);
            shown[r.StepIndex] += r.ReadingG;
        }

        var madeFormulation = f.WithMasses(actual);
        var composition = CompositionEvaluator.Describe(madeFormulation);
        var outcomes = plan.Steps.Select(s => new StepOutcome(s.Index, s.ReagentId, s.TargetMassG, shown[s.Index], actual[s.ComponentIndex], s.ToleranceG)).ToArray();
        var complete = plan.Steps.All(s => s.TargetMassG == 0 || readings.Any(r => r.StepIndex == s.Index));
        var spec = SpecQuantities.For(f, f.Recipe.Spec)
            .Select(q => new QuantityDeviation(q.Name, q.Target.Value, q.Evaluate(actual), q.Target.TolerancePct)).ToArray();
        var nominal = CompositionEvaluator.Describe(f);
        var ratios = f.Lines.Select(l => new QuantityDeviation(
            $"ratio:{l.ReagentId}", nominal.Components[l.Index].MolPerMolPrecursor, composition.Components[l.Index].MolPerMolPrecursor,
            RatioTolerancePct(f.Recipe.Spec, l.ReagentId, options))).ToArray();
        return new AsMadeReport(composition, outcomes, spec, ratios, complete, Warnings(composition, spec, ratios, complete));
    }

    private static double RatioTolerancePct(FormulationSpec? spec, string reagentId, PlanOptions options) =>
        spec?.Ratios.FirstOrDefault(r => string.Equals(r.ReagentId, reagentId, StringComparison.OrdinalIgnoreCase))?.Target.TolerancePct
        ?? options.StepLimitPct(reagentId);

    private static List<string> Warnings(SolComposition c, QuantityDeviation[] spec, QuantityDeviation[] ratios, bool complete)
    {
        var warnings = new List<string>(c.Warnings);
        if (!complete)
        {
            warnings.Add("The batch is not complete: steps without a recorded addition count as nothing added.");
        }

        foreach (var d in spec.Concat(ratios).Where(d => !d.WithinTolerance && d.Nominal != 0))
        {
            warnings.Add(string.Create(CultureInfo.InvariantCulture,
                $"{d.Quantity} is {d.Actual:0.####} against {d.Nominal:0.####} ({d.DeviationPct:+0.##;-0.##} %), outside ± {d.TolerancePct:0.##} %."));
        }

        return warnings;
    }
}
