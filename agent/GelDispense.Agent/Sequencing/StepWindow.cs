using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Sequencing;

/// <summary>
/// A plan step as readings on the balance. The plan states its window on the true mass (target ± acceptance, the
/// spec's window less the device's expected error); buoyancy makes reading and true mass proportional for one
/// reagent, so the band converts with the step's own ratio of target mass to target reading. A pipette step also
/// converts a reading to the volume delivered, with the ratio of its target volume to its target reading: the
/// reagent's density at the recipe temperature, as the plan used it.
/// </summary>
public sealed record StepWindow(int StepIndex, double TargetReadingG, double LowReadingG, double HighReadingG, double TrueGPerReadingG, double? MlPerReadingG)
{
    public static StepWindow For(PlanStep step)
    {
        var truePerReading = step.TargetReadingG > 0 ? step.TargetMassG / step.TargetReadingG : 1;
        double? mlPerReading = step.HasTargetVolumeMl && step.TargetReadingG > 0 ? step.TargetVolumeMl / step.TargetReadingG : null;
        return new StepWindow(
            step.Index,
            step.TargetReadingG,
            (step.TargetMassG - step.AcceptanceG) / truePerReading,
            (step.TargetMassG + step.AcceptanceG) / truePerReading,
            truePerReading,
            mlPerReading);
    }

    public bool ByVolume => MlPerReadingG is not null;

    public WindowPosition Position(double netReadingG) =>
        netReadingG < LowReadingG ? WindowPosition.Below
        : netReadingG > HighReadingG ? WindowPosition.Above
        : WindowPosition.Inside;

    public double TrueMassG(double netReadingG) => netReadingG * TrueGPerReadingG;

    /// <summary>The volume a net reading stands for on a pipette step, mL; null on a balance step.</summary>
    public double? VolumeMl(double netReadingG) => netReadingG * MlPerReadingG;

    /// <summary>Density used for the mass-to-volume check, g/mL (true mass per volume at the recipe temperature).</summary>
    public double? DensityGPerMl => MlPerReadingG is { } ml && ml > 0 ? TrueGPerReadingG / ml : null;
}
