using GelDispense.Chemistry.Reagents.Catalog;

namespace GelDispense.Chemistry.Reagents;

/// <summary>
/// The reagents GelDispense ships with: sol-gel precursors, solvents and water, catalysts and additives. Every
/// entry's <see cref="Reagent.Source"/> says where each number came from and how sure it is.
/// </summary>
public static class BuiltInReagents
{
    /// <summary>All built-in reagents, precursors first, each id unique.</summary>
    public static IReadOnlyList<Reagent> All { get; } =
        [.. Precursors.All, .. Solvents.All, .. Catalysts.All, .. Additives.All];

    /// <summary>A new catalog holding every built-in reagent, prepared; callers may add their own to it.</summary>
    public static ReagentCatalog CreateCatalog() => new(All);
}
