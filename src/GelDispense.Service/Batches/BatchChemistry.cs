using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Metrology;
using GelDispense.Contracts.V1;
using GelDispense.Service.Api;
using GelDispense.Service.Mapping;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Batches;

/// <summary>
/// The chemistry of one stored batch: its recipe resolved against the catalog, and the air density of its
/// setup. Turns balance readings into true masses (buoyancy) and additions into the as-made composition.
/// </summary>
public sealed class BatchChemistry
{
    private readonly Formulation _formulation;
    private readonly double _airKgPerM3;

    private BatchChemistry(Formulation formulation, double airKgPerM3)
    {
        _formulation = formulation;
        _airKgPerM3 = airKgPerM3;
    }

    public static async Task<BatchChemistry> LoadAsync(Contract.Recipe recipe, Contract.AirConditions? air, ReagentDirectory reagents, CancellationToken cancellationToken)
    {
        var catalog = await reagents.LookupAsync(cancellationToken);
        var formulation = Formulation.Prepare(RecipeMapping.ToChemistry(recipe), catalog);
        return new BatchChemistry(formulation, AirDensity.KgPerM3(DeviceMapping.ToChemistry(air, "air")));
    }

    /// <summary>The true mass behind a net reading of this step's reagent (OIML R 111 / NIST SOP 2 buoyancy form).</summary>
    public double TrueMassG(PlanStep step, double readingG) =>
        Buoyancy.TrueMassFromReadingG(readingG, Line(step).DensityGPerMl, _airKgPerM3);

    /// <summary>
    /// The composition from the true masses recorded so far, against the plan's targets as nominal. Empty
    /// composition while no precursor is in the vessel: R and oxide density are undefined until then.
    /// </summary>
    public AsMade AsMade(string batchId, DispensingPlan plan, IReadOnlyList<Contract.Addition> additions, Contract.FormulationSpec? spec)
    {
        var nominal = new double[_formulation.Lines.Count];
        var actual = new double[_formulation.Lines.Count];
        foreach (var step in plan.Steps)
        {
            nominal[Line(step).Index] += step.TargetMassG;
        }

        var steps = plan.Steps.ToDictionary(s => s.Index);
        foreach (var addition in additions)
        {
            actual[Line(steps[addition.StepIndex]).Index] += addition.TrueMassG;
        }

        var asMade = new AsMade { BatchId = batchId, StepsDone = additions.Select(a => a.StepIndex).Distinct().Count() };
        var made = _formulation.WithMasses(actual);
        if (!(made.Totals().PrecursorMol > 0))
        {
            return asMade;
        }

        var actualSol = CompositionEvaluator.Describe(made);
        var nominalSol = CompositionEvaluator.Describe(_formulation.WithMasses(nominal));
        asMade.Composition = CompositionMapping.ToContract(actualSol);
        asMade.Deviations.Add(DeviationOf("hydrolysisRatio", nominalSol.HydrolysisRatio, actualSol.HydrolysisRatio, spec?.HydrolysisRatio));
        asMade.Deviations.Add(DeviationOf("oxideDensityGPerMl", nominalSol.OxideDensityGPerMl, actualSol.OxideDensityGPerMl, spec?.OxideDensityGPerMl));
        foreach (var ratio in spec?.Ratios ?? [])
        {
            asMade.Deviations.Add(DeviationOf($"ratio:{ratio.ReagentId}", RatioOf(nominalSol, ratio.ReagentId), RatioOf(actualSol, ratio.ReagentId), ratio.Target));
        }

        asMade.WithinSpec = asMade.Deviations.All(d => d.WithinTolerance);
        return asMade;
    }

    private FormulationLine Line(PlanStep step) =>
        step.ComponentIndex >= 0 && step.ComponentIndex < _formulation.Lines.Count
            ? _formulation.Lines[step.ComponentIndex]
            : throw new InvalidOperationException($"Plan step {step.Index} names component {step.ComponentIndex}, which the recipe does not have.");

    private static double RatioOf(SolComposition sol, string reagentId) =>
        sol.Components.Where(c => string.Equals(c.ReagentId, reagentId, StringComparison.OrdinalIgnoreCase)).Sum(c => c.MolPerMolPrecursor);

    private static Deviation DeviationOf(string quantity, double nominal, double actual, Contract.SpecTarget? tolerance)
    {
        var deviationPct = nominal != 0 ? (actual - nominal) / nominal * 100 : 0;
        var deviation = new Deviation { Quantity = quantity, Nominal = nominal, Actual = actual, DeviationPct = deviationPct };
        if (tolerance is not null)
        {
            deviation.TolerancePct = tolerance.TolerancePct;
        }

        deviation.WithinTolerance = tolerance is null || Math.Abs(deviationPct) <= tolerance.TolerancePct;
        return deviation;
    }
}
