using GelDispense.Chemistry.Reagents;

namespace GelDispense.Chemistry.Composition;

/// <summary>A recipe line resolved to its prepared reagent and its density at the recipe temperature.</summary>
public sealed record FormulationLine(int Index, PreparedReagent Reagent, int Stage, double DensityGPerMl)
{
    public string ReagentId => Reagent.Id;

    public double VolumeMlPerG => 1.0 / DensityGPerMl;
}
