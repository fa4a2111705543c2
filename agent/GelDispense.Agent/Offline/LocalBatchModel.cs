using System.Globalization;
using GelDispense.Agent.Sequencing;
using GelDispense.Chemistry.AsMade;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Metrology;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Reagents;
using GelDispense.Chemistry.Replanning;
using GelDispense.Service.Api;
using GelDispense.Service.Mapping;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Agent.Offline;

/// <summary>
/// The batch in the chemistry library's terms, so the station can judge, re-plan and report as-made while the
/// service is unreachable. It is rebuilt from the batch the service last sent: the recipe revision, the devices
/// and the targets of the plan in force, with the built-in reagent catalog plus the recipe's inline reagents.
/// The service stays the authority; after a replay its answers replace what was worked out here.
/// </summary>
public sealed class LocalBatchModel
{
    private readonly DispensingPlan _basis;
    private readonly PlanRequest _request;
    private readonly Contract.BatchScale? _scale;

    private LocalBatchModel(DispensingPlan basis, PlanRequest request, Contract.BatchScale? scale)
    {
        _basis = basis;
        _request = request;
        _scale = scale;
    }

    /// <summary>Builds the model; throws when the recipe names reagents only the service's database knows.</summary>
    public static LocalBatchModel Create(Contract.Batch batch)
    {
        var recipe = RecipeMapping.ToChemistry(batch.Recipe);
        var request = Planner.Request(batch.Balance, batch.Pipette, batch.Air, batch.Options);
        var prepared = Formulation.Prepare(recipe, BuiltInReagents.CreateCatalog());
        var massesG = new double[prepared.Lines.Count];
        foreach (var step in batch.Steps)
        {
            massesG[step.ComponentIndex] += step.TargetMassG;
        }

        var basis = PlanBuilder.Build(prepared.WithMasses(massesG), request);
        var mismatch = batch.Steps.FirstOrDefault(s => s.Index >= basis.Steps.Count || !string.Equals(basis.Steps[s.Index].ReagentId, s.ReagentId, StringComparison.OrdinalIgnoreCase));
        return mismatch is null
            ? new LocalBatchModel(basis, request, batch.Recipe.Scale)
            : throw new InvalidOperationException($"the local plan does not line up with the service's at step {mismatch.Index} ({mismatch.ReagentId})");
    }

    /// <summary>True mass behind a net reading of a step's reagent (buoyancy as in the plan's air).</summary>
    public double TrueMassG(int stepIndex, double readingG) =>
        Buoyancy.TrueMassFromReadingG(readingG, _basis.Steps[stepIndex].DensityGPerMl, _basis.AirDensityKgPerM3);

    /// <summary>Judges an addition against the step in force, as the service would, and re-plans when it is out of window.</summary>
    public LocalOutcome Judge(Contract.PlanStep inForce, double readingG, IReadOnlyList<MadeAddition> earlier, string additionId)
    {
        var trueMassG = TrueMassG(inForce.Index, readingG);
        var stepMassG = trueMassG + earlier.Where(a => a.StepIndex == inForce.Index).Sum(a => a.TrueMassG);
        var within = !inForce.Done && Math.Abs(stepMassG - inForce.TargetMassG) <= inForce.AcceptanceG + (1e-9 * inForce.TargetMassG);
        if (within)
        {
            return new LocalOutcome(trueMassG, true, [], null, []);
        }

        List<MadeAddition> all = [.. earlier, new MadeAddition(additionId, inForce.Index, readingG, trueMassG, false, false)];
        var result = Replanner.Replan(_basis, [.. all.Select(a => new RecordedAddition(a.StepIndex, a.TrueMassG))], _request);
        var plan = PlanMapping.ToContract(result.Plan, _scale);
        var remaining = plan.Steps.Where(s => !s.Done && all.All(a => a.StepIndex != s.Index)).ToArray();
        var warnings = result.Warnings.Append(string.Create(CultureInfo.InvariantCulture,
            $"Re-planned at the station (offline): batch factor {result.ScaleFactor:0.000}; the service re-plans again when the journal is replayed."));
        return new LocalOutcome(trueMassG, false, remaining, plan.Predicted, [.. warnings]);
    }

    /// <summary>The as-made composition from the readings so far, with deviations flagged against the spec.</summary>
    public Contract.AsMade AsMade(string batchId, IReadOnlyList<MadeAddition> additions)
    {
        var precursorIn = additions.Any(a => a.TrueMassG > 0 && _basis.Formulation.Lines[_basis.Steps[a.StepIndex].ComponentIndex].Reagent.PrecursorMolPerG > 0);
        var report = precursorIn
            ? AsMadeCalculator.Compute(_basis, [.. additions.Select(a => new RecordedReading(a.StepIndex, a.ReadingG))], _request.Options)
            : null;
        return AsMadeMapping.ToContract(batchId, report, additions.Select(a => a.StepIndex).Distinct().Count());
    }
}
