using GelDispense.Chemistry.Composition;

namespace GelDispense.Chemistry.AsMade;

/// <summary>The composition recomputed from what was weighed, with every deviation from the plan flagged.</summary>
public sealed record AsMadeReport(
    SolComposition Composition,
    IReadOnlyList<StepOutcome> Steps,
    IReadOnlyList<QuantityDeviation> SpecDeviations,
    IReadOnlyList<QuantityDeviation> RatioDeviations,
    bool Complete,
    IReadOnlyList<string> Warnings)
{
    public bool InsideSpec => SpecDeviations.All(d => d.WithinTolerance);
}
