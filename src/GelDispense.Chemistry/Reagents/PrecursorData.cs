namespace GelDispense.Chemistry.Reagents;

/// <summary>
/// What a precursor turns into. <paramref name="OxideFormula"/> per formula unit of oxide
/// (SiO2, TiO2, AlO1.5, CH3SiO1.5), <paramref name="OxidePerMol"/> oxide units per mole of precursor,
/// <paramref name="HydrolysableGroups"/> alkoxide groups per molecule (4 for TEOS, 3 for MTMS),
/// <paramref name="OxideSkeletalDensityGPerMl"/> for the solids fraction, and the alcohol each group
/// releases on hydrolysis (C2H5OH for ethoxides).
/// </summary>
public sealed record PrecursorData(
    string OxideFormula,
    double OxidePerMol,
    int HydrolysableGroups,
    double OxideSkeletalDensityGPerMl,
    string LeavingAlcoholFormula);
