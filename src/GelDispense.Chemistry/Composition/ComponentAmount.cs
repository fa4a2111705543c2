namespace GelDispense.Chemistry.Composition;

/// <summary>One component of a composition: mass as supplied, moles of its active substance, volume at temperature.</summary>
public sealed record ComponentAmount(
    string ReagentId,
    int Stage,
    double MassG,
    double Moles,
    double VolumeMl,
    double WaterMol,
    double MolPerMolPrecursor);
