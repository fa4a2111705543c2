namespace GelDispense.Chemistry.Reagents;

/// <summary>
/// A reagent as it stands on the shelf. <see cref="Formula"/> names its active substance and
/// <see cref="AssayPct"/> the mass percentage of that substance in the reagent as supplied; any further
/// parts (the water of an aqueous acid, the solvent of an alkoxide solution) are <see cref="Constituents"/>.
/// <see cref="Source"/> says where each number came from.
/// </summary>
public sealed record Reagent
{
    public required string Id { get; init; }

    public required string Name { get; init; }

    public required string Formula { get; init; }

    public required ReagentRole Role { get; init; }

    public required DensityModel Density { get; init; }

    /// <summary>Overrides the molar mass derived from <see cref="Formula"/> (for example for an oligomeric precursor).</summary>
    public double? MolarMassOverrideGPerMol { get; init; }

    public double AssayPct { get; init; } = 100;

    /// <summary>A solid is weighed, never pipetted.</summary>
    public bool IsSolid { get; init; }

    public PrecursorData? Precursor { get; init; }

    public IReadOnlyList<SolutionConstituent> Constituents { get; init; } = [];

    /// <summary>GHS hazard statement codes (H225, H314, …) of the reagent as supplied.</summary>
    public IReadOnlyList<string> GhsHazards { get; init; } = [];

    public string Source { get; init; } = "";
}
