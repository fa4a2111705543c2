namespace GelDispense.Chemistry.Composition;

/// <summary>
/// What the formulation must hold: R (water : precursor), the oxide density of the wet gel, and
/// optionally other mole ratios. <see cref="FreeSolventIds"/> names the solvent(s) the spec solver may
/// adjust to reach the density (their recipe amounts fix their proportions to each other).
/// </summary>
public sealed record FormulationSpec
{
    public SpecTarget? HydrolysisRatio { get; init; }

    public SpecTarget? OxideDensityGPerMl { get; init; }

    public IReadOnlyList<RatioSpec> Ratios { get; init; } = [];

    public IReadOnlyList<string> FreeSolventIds { get; init; } = [];
}
