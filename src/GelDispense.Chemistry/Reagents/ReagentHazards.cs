namespace GelDispense.Chemistry.Reagents;

/// <summary>
/// A reagent's hazard codes (normalised), its handling classes and the caution lines for it alone, worked out
/// once when the reagent is prepared: cautions go on every composition and every plan step, and finding the
/// classes that codes cannot carry means parsing the reagent's formulas.
/// </summary>
internal sealed class ReagentHazards
{
    private ReagentHazards(string[] codes, int classMask, IReadOnlyList<string> cautions)
    {
        Codes = codes;
        ClassMask = classMask;
        Cautions = cautions;
    }

    public IReadOnlyList<string> Codes { get; }

    /// <summary>The reagent's <see cref="HazardClass"/>es as bits (see <see cref="HandlingCautions.MaskOf"/>).</summary>
    public int ClassMask { get; }

    /// <summary>The reagent's own caution lines, read-only because every step of that reagent shares them.</summary>
    public IReadOnlyList<string> Cautions { get; }

    public static ReagentHazards Of(Reagent reagent)
    {
        var codes = reagent.GhsHazards.Select(GhsStatements.Normalize).ToArray();
        var mask = HandlingCautions.MaskOf(HandlingCautions.ClassesOf(codes).Concat(HandlingCautions.ClassesOf(reagent)));
        return new ReagentHazards(codes, mask, HandlingCautions.Compose([.. codes], mask).AsReadOnly());
    }
}
