using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Metrology;
using GelDispense.Chemistry.Reagents;
using GelDispense.Chemistry.Solving;
using GelDispense.Chemistry.Tolerances;

namespace GelDispense.Chemistry.Planning;

/// <summary>Builds the gravimetric plan (design §3): steps, readings, windows from the spec, capability and the minimum batch.</summary>
public static class PlanBuilder
{
    /// <summary>Solves the recipe against its spec when the spec names a density, then plans it.</summary>
    public static DispensingPlan Build(Recipe recipe, IReagentLookup catalog, PlanRequest request)
    {
        var formulation = recipe.Spec?.OxideDensityGPerMl is null
            ? Formulation.Prepare(recipe, catalog)
            : SpecSolver.Solve(recipe, catalog).Formulation;
        return Build(formulation, request);
    }

    public static DispensingPlan Build(Formulation formulation, PlanRequest request) => Build(formulation, request, null);

    /// <summary>Plans the remaining steps of a batch whose <paramref name="doneLines"/> are already in the vessel.</summary>
    internal static DispensingPlan Build(Formulation formulation, PlanRequest request, IReadOnlySet<int>? doneLines)
    {
        Validate(formulation, request);
        var options = request.OptionsOrDefault;
        var quantities = SpecQuantities.For(formulation, formulation.Recipe.Spec);
        var draft = PlanDraft.Compute(formulation, quantities, request, doneLines);
        var minimumScale = doneLines is null ? MinimumBatchScale.Find(formulation, quantities, request, draft) : null;
        var airDensity = AirDensity.KgPerM3(request.AirOrStandard);
        var steps = Steps(draft, request, airDensity, minimumScale);
        var checks = Checks(quantities, formulation, draft.WindowsG, options.Mode);
        var warnings = new List<string>();
        if (checks.Any(c => Math.Abs(c.Nominal - c.Target) > c.Target * c.TolerancePct / 100))
        {
            warnings.Add("The nominal composition is already outside the spec; fix the recipe before weighing.");
        }

        if (minimumScale is null && !draft.Feasible && doneLines is null)
        {
            warnings.Add("No batch size makes every step feasible within the balance's capacity; use a more capable balance or a pipette.");
        }

        return new DispensingPlan
        {
            Formulation = formulation,
            Steps = steps,
            Predicted = CompositionEvaluator.Describe(formulation),
            SpecChecks = checks,
            Feasible = draft.Feasible,
            MinimumBatchScale = minimumScale,
            AirDensityKgPerM3 = airDensity,
            Mode = options.Mode,
            Cumulative = options.Cumulative,
            Warnings = warnings,
        };
    }

    private static PlanStep[] Steps(PlanDraft draft, PlanRequest request, double airDensity, double? minimumScale)
    {
        var f = draft.Formulation;
        var steps = new PlanStep[draft.Order.Length];
        var cumulativeReading = 0.0;
        for (var k = 0; k < steps.Length; k++)
        {
            var i = draft.Order[k];
            var line = f.Lines[i];
            var massG = f.MassesG[i];
            var reading = Buoyancy.ReadingFromTrueMassG(massG, line.DensityGPerMl, airDensity);
            cumulativeReading += reading;
            var device = draft.Devices[i];
            steps[k] = new PlanStep
            {
                Index = k,
                ComponentIndex = i,
                ReagentId = line.ReagentId,
                Stage = line.Stage,
                Method = device.Method,
                TargetMassG = massG,
                ToleranceG = draft.WindowsG[i],
                DeviceErrorG = device.ErrorG,
                TargetReadingG = reading,
                CumulativeReadingG = request.OptionsOrDefault.Cumulative ? cumulativeReading : reading,
                TargetVolumeMl = massG * line.VolumeMlPerG,
                DensityGPerMl = line.DensityGPerMl,
                Feasible = draft.StepFeasible(i),
                Done = draft.DoneLines.Contains(i),
                Problem = StepAdvice.Problem(draft, i),
                Suggestions = StepAdvice.For(draft, i, request, minimumScale),
                Cautions = GhsStatements.Cautions([line.Reagent]),
                Notes = device.Method == DispensingMethod.Balance && StepDevice.UspNote(request.Balance, massG) is { } note ? [note] : [],
                BalanceVerifies = device.Method == DispensingMethod.Pipette
                    && StepDevice.OnBalance(request.Balance, massG, draft.GrossG[i]) is { Usable: true } b && b.ErrorG <= device.ErrorG,
            };
        }

        return steps;
    }

    private static SpecCheck[] Checks(IReadOnlyList<SpecQuantity> quantities, Formulation f, double[] windows, ToleranceMode mode)
    {
        var masses = f.MassesG.ToArray();
        return [.. quantities.Select(q =>
        {
            var (low, high) = WorstCase.Range(q, masses, windows);
            var guaranteed = ToleranceAllocator.Holds([q], masses, windows, mode);
            return new SpecCheck(q.Name, q.Target.Value, q.Target.TolerancePct, q.Evaluate(masses), low, high, guaranteed);
        })];
    }

    private static void Validate(Formulation f, PlanRequest request)
    {
        var errors = new List<InputError>(request.Balance.Validate("balance"));
        if (request.Pipette is { } pipette)
        {
            errors.AddRange(pipette.Validate("pipette"));
        }

        errors.AddRange(request.AirOrStandard.Validate("air"));
        errors.AddRange(PlanOptionsValidation.Check(request.OptionsOrDefault, f));
        var spec = f.Recipe.Spec;
        for (var k = 0; k < (spec?.Ratios.Count ?? 0); k++)
        {
            var id = spec!.Ratios[k].ReagentId;
            if (!f.Lines.Any(l => string.Equals(l.ReagentId, id, StringComparison.OrdinalIgnoreCase)))
            {
                errors.Add(new($"recipe.spec.ratios[{k}].reagentId", id ?? "", "not a component of this recipe"));
            }
        }

        if (errors.Count > 0)
        {
            throw new InvalidInputException(errors);
        }
    }
}
