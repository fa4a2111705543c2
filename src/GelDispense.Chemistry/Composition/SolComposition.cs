namespace GelDispense.Chemistry.Composition;

/// <summary>
/// Everything the evaluator reports about a sol (design §2). Densities are of the oxide in the wet gel,
/// assuming full conversion, ideal mixing and no syneresis; the warnings say so.
/// </summary>
public sealed record SolComposition
{
    public required double TemperatureC { get; init; }

    public required CompositionTotals Totals { get; init; }

    public double GelVolumeMl => Totals.VolumeMl;

    public double TotalMassG => Totals.MassG;

    public double OxideMassG => Totals.OxideG;

    public double OxideDensityGPerMl => Totals.OxideDensityGPerMl;

    public double SolidsVolumeFraction => Totals.SolidsVolumeFraction;

    public double Porosity => Totals.Porosity;

    public double HydrolysisRatio => Totals.HydrolysisRatio;

    public double WaterPerHydrolysableGroup => Totals.WaterPerHydrolysableGroup;

    public required HydrolysisRegime Regime { get; init; }

    public double PrecursorMol => Totals.PrecursorMol;

    public double WaterMol => Totals.WaterMol;

    public double SolventRatio => Totals.SolventRatio;

    public double CatalystRatio => Totals.CatalystRatio;

    public double CatalystMolarityMolPerL => Totals.CatalystMolarityMolPerL;

    public double AlcoholReleasedMol => Totals.AlcoholReleasedMol;

    public double AlcoholReleasedG => Totals.AlcoholReleasedG;

    /// <summary>ρ_dry = ρ_ox / (1 − s)³ for the recipe's linear shrinkage s; null when none is given.</summary>
    public double? DriedDensityGPerMl { get; init; }

    public required IReadOnlyList<ComponentAmount> Components { get; init; }

    public required IReadOnlyList<OxideShare> Oxides { get; init; }

    public required IReadOnlyList<StageSummary> Stages { get; init; }

    public required IReadOnlyList<string> Warnings { get; init; }

    public required IReadOnlyList<string> Cautions { get; init; }
}
