using System.Globalization;
using GelDispense.Chemistry.AsMade;
using GelDispense.Chemistry.Composition;
using GelDispense.Contracts.V1;
using GelDispense.Service.Mapping;

namespace GelDispense.Service.Batches;

/// <summary>
/// Where a batch is heading after an addition: the plan in force afterwards, the composition predicted when its
/// remaining steps hit their targets, and that composition against the spec.
/// </summary>
public sealed record BatchOutlook(
    DispensingPlan Plan,
    bool Replanned,
    double ScaleFactor,
    SolComposition Predicted,
    IReadOnlyList<QuantityDeviation> Deviations,
    IReadOnlyList<string> Warnings)
{
    public bool WithinSpec => Deviations.All(d => d.WithinTolerance);

    /// <summary>Steps of the plan not made yet: neither marked done by a re-plan nor holding an addition.</summary>
    public IEnumerable<PlanStep> RemainingSteps(IReadOnlyList<Addition> recorded) =>
        Plan.Steps.Where(s => !s.Done && recorded.All(a => a.StepIndex != s.Index));

    /// <summary>
    /// After an addition in its window the plan stays in force; the prediction puts the masses recorded in place
    /// of the targets of the steps made so far.
    /// </summary>
    public static BatchOutlook Keep(PlanInForce inForce, IReadOnlyList<Addition> recorded)
    {
        var basis = inForce.Basis;
        var massesG = new double[basis.FirstPlan.Formulation.Lines.Count];
        foreach (var step in inForce.Plan.Steps.Where(s => recorded.All(a => a.StepIndex != s.Index)))
        {
            massesG[step.ComponentIndex] += step.TargetMassG;
        }

        foreach (var addition in recorded)
        {
            massesG[basis.FirstPlan.Steps[addition.StepIndex].ComponentIndex] += addition.TrueMassG;
        }

        var deviations = basis.Deviations(massesG);
        var warnings = deviations.Where(d => !d.WithinTolerance).Select(d => string.Create(CultureInfo.InvariantCulture,
            $"Predicted {d.Quantity} {d.Actual:0.####} is outside the spec {d.Nominal:0.####} ± {d.TolerancePct:0.##} %."));
        return new BatchOutlook(inForce.Plan, false, inForce.ScaleFactor, basis.Describe(massesG), deviations, [.. warnings]);
    }

    /// <summary>
    /// After an addition out of its window the library re-plans the remaining steps from the first plan and every
    /// addition so far; the result becomes the next plan revision.
    /// </summary>
    public static BatchOutlook Replan(PlanInForce inForce, IReadOnlyList<Addition> recorded)
    {
        var basis = inForce.Basis;
        var result = basis.Replan(recorded);
        var plan = PlanMapping.ToContract(result.Plan, basis.RequestedScale);
        return new BatchOutlook(plan, true, result.ScaleFactor, result.Plan.Predicted, basis.Deviations(result.Plan.Formulation.MassesG), result.Warnings);
    }
}
