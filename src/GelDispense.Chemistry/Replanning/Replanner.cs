using System.Globalization;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Tolerances;

namespace GelDispense.Chemistry.Replanning;

/// <summary>
/// Retargets the steps not yet made so the final composition comes as close to the spec as it can.
/// Nothing can be taken out of the vessel, so the batch may grow: the unknowns are the remaining masses
/// and the batch factor k. Each spec quantity Q = (a·m)/(b·m) = T becomes the linear condition
/// (a − T·b)·m = 0, weighted heavily; every step's mass is held near k times its planned proportion,
/// weighted lightly (in units of its step limit). A bounded least-squares solve then restores the spec
/// exactly whenever the remaining steps can, and otherwise gives the nearest composition; the vessel
/// capacity enters as a hard condition when the free solution would overflow it.
/// </summary>
public static class Replanner
{
    public static ReplanResult Replan(DispensingPlan plan, IReadOnlyList<RecordedAddition> additions, PlanRequest request, ReplanOptions? options = null)
    {
        options ??= new ReplanOptions();
        var f = plan.Formulation;
        var planned = f.MassesG.ToArray();
        var done = DoneMasses(plan, additions);
        var quantities = SpecQuantities.For(f, f.Recipe.Spec);
        var planOptions = request.OptionsOrDefault;
        var problem = ReplanProblem.Build(f, planned, done, quantities, planOptions, options.AllowTopUps);

        var z = BoundedLeastSquares.Solve(problem.Matrix, problem.Target, problem.Bounded);
        var final = problem.Masses(z);
        var capacityLimited = false;
        if (planOptions.VesselCapacityMl is { } capacity && Volume(f, final) > capacity * (1 + 1e-9))
        {
            capacityLimited = true;
            z = BoundedLeastSquares.Solve(problem.Matrix, problem.Target, problem.Bounded, problem.CapacityEquality(capacity));
            final = problem.Masses(z);
        }

        var replanned = PlanBuilder.Build(f.WithMasses(final), request, new HashSet<int>(done.Keys.Where(i => !options.AllowTopUps || final[i] <= done[i] * (1 + 1e-6))));
        var inside = quantities.All(q => q.Target.Accepts(q.Evaluate(final)));
        var topUps = done.Where(d => final[d.Key] > d.Value * (1 + 1e-6))
            .Select(d => new TopUp(StepOf(plan, d.Key), f.Lines[d.Key].ReagentId, final[d.Key] - d.Value)).ToArray();
        return new ReplanResult(replanned, inside, capacityLimited, problem.Scale(z), topUps, Warnings(quantities, final, inside, capacityLimited));
    }

    private static Dictionary<int, double> DoneMasses(DispensingPlan plan, IReadOnlyList<RecordedAddition> additions)
    {
        var done = new Dictionary<int, double>();
        foreach (var a in additions)
        {
            if (a.StepIndex < 0 || a.StepIndex >= plan.Steps.Count)
            {
                throw new InvalidInputException("stepIndex", a.StepIndex.ToString(CultureInfo.InvariantCulture), $"the plan has steps 0 to {plan.Steps.Count - 1}");
            }

            if (!double.IsFinite(a.TrueMassG) || a.TrueMassG < 0)
            {
                throw new InvalidInputException("trueMassG", a.TrueMassG.ToString("R", CultureInfo.InvariantCulture), "a recorded mass must be zero or positive");
            }

            var line = plan.Steps[a.StepIndex].ComponentIndex;
            done[line] = done.GetValueOrDefault(line) + a.TrueMassG;
        }

        return done;
    }

    private static int StepOf(DispensingPlan plan, int line) => plan.Steps.First(s => s.ComponentIndex == line).Index;

    private static double Volume(Composition.Formulation f, double[] masses) =>
        f.Lines.Sum(l => masses[l.Index] * l.VolumeMlPerG);

    private static string[] Warnings(IReadOnlyList<SpecQuantity> quantities, double[] final, bool inside, bool capacityLimited)
    {
        var warnings = new List<string>();
        foreach (var q in quantities.Where(q => !q.Target.Accepts(q.Evaluate(final))))
        {
            warnings.Add(string.Create(CultureInfo.InvariantCulture,
                $"Predicted {q.Name} {q.Evaluate(final):0.####} is outside the spec {q.Target.Value:0.####} ± {q.Target.TolerancePct:0.##} %; the remaining steps cannot restore it."));
        }

        if (capacityLimited)
        {
            warnings.Add("The vessel's capacity stops the batch from growing enough to absorb the over-pour; this is the nearest composition that fits.");
        }

        if (!inside && !capacityLimited)
        {
            warnings.Add("Consider a corrective top-up of an earlier reagent, or record the batch as off-spec.");
        }

        return [.. warnings];
    }
}
