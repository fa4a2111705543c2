using GelDispense.Chemistry.Planning;

namespace GelDispense.Chemistry.Replanning;

/// <summary>
/// The batch re-planned around what is already in the vessel: the new plan (done steps carry their
/// recorded masses, the rest their new targets and windows), whether the predicted final composition is
/// inside the spec, and whether the vessel's capacity stopped a full recovery.
/// </summary>
public sealed record ReplanResult(
    DispensingPlan Plan,
    bool InsideSpec,
    bool CapacityLimited,
    double ScaleFactor,
    IReadOnlyList<TopUp> TopUps,
    IReadOnlyList<string> Warnings)
{
    public double PredictedHydrolysisRatio => Plan.Predicted.HydrolysisRatio;

    public double PredictedOxideDensityGPerMl => Plan.Predicted.OxideDensityGPerMl;

    public double PredictedGelVolumeMl => Plan.Predicted.GelVolumeMl;
}
