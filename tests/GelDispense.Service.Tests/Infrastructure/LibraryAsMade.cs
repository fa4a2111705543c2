using GelDispense.Chemistry.AsMade;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Reagents;
using GelDispense.Service.Api;
using GelDispense.Service.Mapping;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>
/// The as-made composition from the chemistry library alone, to hold the service's answer to: the batch as first
/// planned (its stored targets, the built-in reagents, its devices) and the readings, in g as the balance showed them,
/// by step. Shared with the scale-out tests (linked there).
/// </summary>
internal static class LibraryAsMade
{
    public static SolComposition Of(Contract.Batch batch, IEnumerable<(int StepIndex, double ReadingG)> readings)
    {
        var prepared = Formulation.Prepare(RecipeMapping.ToChemistry(batch.Recipe), BuiltInReagents.CreateCatalog());
        var massesG = new double[prepared.Lines.Count];
        foreach (var step in batch.Steps)
        {
            massesG[step.ComponentIndex] += step.TargetMassG;
        }

        var request = Planner.Request(batch.Balance, batch.Pipette, batch.Air, batch.Options);
        var plan = PlanBuilder.Build(prepared.WithMasses(massesG), request);
        return AsMadeCalculator.Compute(plan, [.. readings.Select(r => new RecordedReading(r.StepIndex, r.ReadingG))], request.Options).Composition;
    }
}
