using GelDispense.Chemistry.AsMade;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Metrology;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Replanning;
using GelDispense.Chemistry.Tolerances;
using GelDispense.Service.Api;
using GelDispense.Service.Mapping;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Batches;

/// <summary>
/// A stored batch in the chemistry library's terms: its first plan, rebuilt from the recipe revision and the
/// targets stored at creation, and the station's devices. Everything here is fixed when the batch starts, so one
/// instance serves every later addition (see <see cref="BatchPlanCache"/>). Re-plans and as-made reports are the
/// library's <see cref="Replanner"/> and <see cref="AsMadeCalculator"/> working from this first plan.
/// </summary>
public sealed class BatchBasis
{
    private BatchBasis(Contract.DispensingPlan storedFirstPlan, DispensingPlan firstPlan, PlanRequest request, Contract.BatchScale? requestedScale)
    {
        StoredFirstPlan = storedFirstPlan;
        FirstPlan = firstPlan;
        Request = request;
        RequestedScale = requestedScale;
        Quantities = SpecQuantities.For(firstPlan.Formulation, firstPlan.Formulation.Recipe.Spec);
    }

    /// <summary>Plan revision 0 as stored when the batch started.</summary>
    public Contract.DispensingPlan StoredFirstPlan { get; }

    /// <summary>The same plan in the library's terms.</summary>
    public DispensingPlan FirstPlan { get; }

    public PlanRequest Request { get; }

    /// <summary>The scale the recipe asked for, so a re-plan's minimum batch reads in the same quantity.</summary>
    public Contract.BatchScale? RequestedScale { get; }

    /// <summary>The spec quantities (R, oxide density, the spec's ratios) as functions of the masses.</summary>
    public IReadOnlyList<SpecQuantity> Quantities { get; }

    /// <summary>
    /// The stored first-plan targets are what the station was told, so they fix the masses; the library only
    /// re-derives windows, densities and air from them. A library upgrade therefore cannot move a running batch.
    /// </summary>
    public static async Task<BatchBasis> CreateAsync(
        Contract.Recipe recipe, Contract.CreateBatchRequest setup, Contract.DispensingPlan firstPlan, ReagentDirectory reagents, CancellationToken cancellationToken)
    {
        var request = Planner.Request(setup.Balance, setup.Pipette, setup.Air, setup.Options);
        var chemistryRecipe = RecipeMapping.ToChemistry(recipe);
        var prepared = Formulation.Prepare(chemistryRecipe, await reagents.LookupAsync(chemistryRecipe, cancellationToken));
        var massesG = new double[prepared.Lines.Count];
        foreach (var step in firstPlan.Steps)
        {
            massesG[step.ComponentIndex] += step.TargetMassG;
        }

        return new BatchBasis(firstPlan, PlanBuilder.Build(prepared.WithMasses(massesG), request), request, recipe.Scale);
    }

    /// <summary>The true mass behind a net reading of a step's reagent (OIML R 111 / NIST SOP 2 buoyancy form).</summary>
    public double TrueMassG(int stepIndex, double readingG)
    {
        var step = FirstPlan.Steps[stepIndex];
        return Buoyancy.TrueMassFromReadingG(readingG, step.DensityGPerMl, FirstPlan.AirDensityKgPerM3);
    }

    public bool AddsPrecursor(int stepIndex) =>
        FirstPlan.Formulation.Lines[FirstPlan.Steps[stepIndex].ComponentIndex].Reagent.PrecursorMolPerG > 0;

    /// <summary>The remaining steps retargeted around everything recorded so far (no top-ups of steps already made).</summary>
    public ReplanResult Replan(IEnumerable<Contract.Addition> additions) =>
        Replanner.Replan(FirstPlan, [.. additions.Select(a => new RecordedAddition(a.StepIndex, a.TrueMassG))], Request);

    /// <summary>
    /// The library's as-made report from the readings as the balance showed them; null while no precursor is in the
    /// vessel, since R and the oxide density are undefined until one is.
    /// </summary>
    public AsMadeReport? AsMade(IReadOnlyList<Contract.Addition> additions) =>
        additions.Any(a => a.TrueMassG > 0 && AddsPrecursor(a.StepIndex))
            ? AsMadeCalculator.Compute(FirstPlan, [.. additions.Select(a => new RecordedReading(a.StepIndex, a.ReadingG))], Request.Options)
            : null;

    /// <summary>The composition of final masses given in g, in recipe order.</summary>
    public SolComposition Describe(double[] finalMassesG) => CompositionEvaluator.Describe(FirstPlan.Formulation.WithMasses(finalMassesG));

    /// <summary>Each spec quantity of final masses (g, in recipe order) against its target and tolerance.</summary>
    public QuantityDeviation[] Deviations(IReadOnlyList<double> finalMassesG)
    {
        var masses = finalMassesG.ToArray();
        return [.. Quantities.Select(q => new QuantityDeviation(q.Name, q.Target.Value, q.Evaluate(masses), q.Target.TolerancePct))];
    }
}
