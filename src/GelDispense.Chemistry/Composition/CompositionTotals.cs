namespace GelDispense.Chemistry.Composition;

/// <summary>
/// The sums every reported quantity derives from. Each sum is linear in the component masses, so each
/// spec quantity (R, oxide density, a mole ratio) is a ratio of two linear forms — the fact the tolerance
/// allocator builds on.
/// </summary>
public readonly record struct CompositionTotals(
    double MassG,
    double VolumeMl,
    double PrecursorMol,
    double WaterMol,
    double CatalystMol,
    double SolventMol,
    double HydrolysableGroupMol,
    double OxideG,
    double OxideSkeletalMl,
    double AlcoholReleasedMol,
    double AlcoholReleasedG)
{
    /// <summary>R = mol water / mol precursor (all precursors together).</summary>
    public double HydrolysisRatio => WaterMol / PrecursorMol;

    /// <summary>Oxide mass per wet-gel volume, g/mL, assuming full conversion and ideal mixing.</summary>
    public double OxideDensityGPerMl => OxideG / VolumeMl;

    public double SolidsVolumeFraction => OxideSkeletalMl / VolumeMl;

    public double Porosity => 1.0 - SolidsVolumeFraction;

    public double WaterPerHydrolysableGroup => HydrolysableGroupMol > 0 ? WaterMol / HydrolysableGroupMol : 0;

    /// <summary>Mole-weighted mean number of hydrolysable groups per precursor molecule.</summary>
    public double MeanHydrolysableGroups => PrecursorMol > 0 ? HydrolysableGroupMol / PrecursorMol : 0;

    public double SolventRatio => SolventMol / PrecursorMol;

    public double CatalystRatio => CatalystMol / PrecursorMol;

    public double CatalystMolarityMolPerL => VolumeMl > 0 ? CatalystMol / (VolumeMl / 1000.0) : 0;

    public static CompositionTotals From(IReadOnlyList<FormulationLine> lines, ReadOnlySpan<double> massesG)
    {
        double mass = 0, volume = 0, precursor = 0, water = 0, catalyst = 0, solvent = 0;
        double groups = 0, oxide = 0, skeletal = 0, alcoholMol = 0, alcoholG = 0;
        for (var i = 0; i < lines.Count; i++)
        {
            var m = massesG[i];
            var r = lines[i].Reagent;
            mass += m;
            volume += m * lines[i].VolumeMlPerG;
            precursor += m * r.PrecursorMolPerG;
            water += m * r.WaterMolPerG;
            catalyst += m * r.CatalystMolPerG;
            solvent += m * r.SolventMolPerG;
            groups += m * r.HydrolysableGroupMolPerG;
            oxide += m * r.OxideGPerG;
            skeletal += m * r.OxideSkeletalMlPerG;
            alcoholMol += m * r.AlcoholReleasedMolPerG;
            alcoholG += m * r.AlcoholReleasedGPerG;
        }

        return new(mass, volume, precursor, water, catalyst, solvent, groups, oxide, skeletal, alcoholMol, alcoholG);
    }
}
