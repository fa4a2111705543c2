namespace GelDispense.Chemistry.Reagents.Catalog;

/// <summary>
/// Additives: a chelating agent that slows the hydrolysis of transition-metal alkoxides, and a drying control
/// chemical additive that evens out pore sizes and drying stresses.
/// </summary>
internal static class Additives
{
    public static IReadOnlyList<Reagent> All { get; } =
    [
        new()
        {
            Id = "acac", Name = "acetylacetone (2,4-pentanedione)", Formula = "CH3COCH2COCH3", Role = ReagentRole.Additive,
            Density = new LinearDensity(0.975, 25, -0.0010),
            GhsHazards = ["H226", "H302", "H311", "H331"],
            Source = "M 100.117 g/mol from the formula (IUPAC weights, §8). Density 0.975 g/mL at 25 °C from memory (supplier "
                + "label); dρ/dT −0.0010 g/mL/K estimate. GHS: from memory (H226 and H302 the EU harmonised entry; H311 and "
                + "H331 as suppliers label it).",
        },
        new()
        {
            Id = "formamide", Name = "formamide (drying control chemical additive)", Formula = "HCONH2", Role = ReagentRole.Additive,
            Density = new LinearDensity(1.1334, 20, -0.0009),
            GhsHazards = ["H351", "H360D", "H373"],
            Source = "M 45.041 g/mol from the formula (IUPAC weights, §8). Density 1.1334 g/mL at 20 °C from memory (CRC); "
                + "dρ/dT −0.0009 g/mL/K estimate. GHS: H360D is the EU harmonised entry (Repr. 1B); H351 and H373 as suppliers "
                + "label it, from memory.",
        },
    ];
}
