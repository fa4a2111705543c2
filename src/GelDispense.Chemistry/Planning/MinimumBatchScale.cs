using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Tolerances;

namespace GelDispense.Chemistry.Planning;

/// <summary>
/// The smallest factor on the batch size at which every step is feasible. Windows grow in proportion to
/// the batch while device errors grow slowly or not at all, so each round multiplies by the worst
/// error/window ratio (and by what the minimum weight asks) and checks the plan at that size, until it holds.
/// Null when the balance's capacity is reached first.
/// </summary>
internal static class MinimumBatchScale
{
    private const int MaxRounds = 40;
    private const double Margin = 1.002;

    public static double? Find(Formulation f, IReadOnlyList<SpecQuantity> quantities, PlanRequest request, PlanDraft atOne)
    {
        if (atOne.Feasible)
        {
            return 1.0;
        }

        var scale = 1.0;
        var draft = atOne;
        for (var round = 0; round < MaxRounds; round++)
        {
            var need = Needed(draft, request);
            if (need is null)
            {
                return null;
            }

            scale *= Math.Max(need.Value * Margin, 1.01);
            var scaled = f.WithMasses([.. f.MassesG.Select(m => m * scale)]);
            draft = PlanDraft.Compute(scaled, quantities, request);
            if (draft.GrossG.Max() > request.Balance.CapacityG)
            {
                return null;
            }

            if (draft.Feasible)
            {
                return scale;
            }
        }

        return null;
    }

    /// <summary>How much larger the batch must get for the worst step, or null if size cannot help.</summary>
    private static double? Needed(PlanDraft draft, PlanRequest request)
    {
        var need = 1.0;
        foreach (var i in draft.Order)
        {
            if (draft.StepFeasible(i))
            {
                continue;
            }

            var m = draft.Formulation.MassesG[i];
            var d = draft.Devices[i];
            if (draft.GrossG[i] > request.Balance.CapacityG)
            {
                return null;
            }

            if (draft.WindowsG[i] <= 0)
            {
                return null;
            }

            var minimum = Math.Max(request.Balance.MinimumWeightG ?? 0, Metrology.BalanceCapability.UspMinimumWeightG(request.Balance));
            need = Math.Max(need, d.Usable ? d.ErrorG / draft.WindowsG[i] : minimum / m);
        }

        return need;
    }
}
