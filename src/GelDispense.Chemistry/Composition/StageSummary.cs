namespace GelDispense.Chemistry.Composition;

/// <summary>The sol as it stands after a stage, counting every component of that stage and those before.</summary>
public sealed record StageSummary(
    int Stage,
    double VolumeMl,
    double PrecursorMol,
    double WaterMol,
    double HydrolysisRatio,
    double OxideDensityGPerMl,
    double CatalystMolarityMolPerL);
