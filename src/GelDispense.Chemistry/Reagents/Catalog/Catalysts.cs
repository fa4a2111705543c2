namespace GelDispense.Chemistry.Reagents.Catalog;

/// <summary>
/// Acid, base and fluoride catalysts. Aqueous ones carry their water as a constituent, so it counts in R.
/// Temperature coefficients of the concentrated solutions are estimates: no source at hand gives them.
/// </summary>
internal static class Catalysts
{
    private const double HclMolarMassGPerMol = 36.458;
    private const double Nh3MolarMassGPerMol = 17.031;

    // hcl-0.1m: 0.1 mol/L × 36.458 g/mol = 3.6458 g HCl in one litre of solution. That litre weighs
    // 1000 mL × 1.0000 g/mL = 1000.0 g at 20 °C (from memory, CRC-type tables: 1.00 wt % HCl is 1.0031 g/mL and
    // water 0.9982, so 0.36 wt % adds ≈ 0.0018). w = 3.6458 / 1000.0 = 0.0036458, i.e. 0.36458 wt % HCl.
    private const double Hcl01MDensity20CGPerMl = 1.0000;
    private static readonly double Hcl01MMassFraction = DiluteAqueous.MassFraction(0.1, HclMolarMassGPerMol, Hcl01MDensity20CGPerMl);

    // nh3-1m: 1 mol/L × 17.031 g/mol = 17.031 g NH3 per litre; the litre weighs 990.7 g at 20 °C (from memory,
    // CRC-type tables: 1 wt % 0.9939 g/mL, 2 wt % 0.9895, interpolated at 1.72 %). w = 17.031 / 990.7 = 0.017191.
    private const double Nh31MDensity20CGPerMl = 0.9907;
    private static readonly double Nh31MMassFraction = DiluteAqueous.MassFraction(1.0, Nh3MolarMassGPerMol, Nh31MDensity20CGPerMl);

    public static IReadOnlyList<Reagent> All { get; } =
    [
        new()
        {
            Id = "hcl-37", Name = "hydrochloric acid 37 %", Formula = "HCl", Role = ReagentRole.Catalyst, AssayPct = 37,
            Constituents = [new SolutionConstituent("H2O", 0.63, ReagentRole.Water)],
            Density = new LinearDensity(1.184, 20, -0.0005),
            GhsHazards = ["H290", "H314", "H335"],
            Source = "M(HCl) 36.458 g/mol (§7). Density 1.184 g/mL at 20 °C, interpolated between 36 % 1.179 and 38 % 1.189 "
                + "(§7 V); dρ/dT −0.0005 g/mL/K estimate. Water 63 % by difference. GHS: EU harmonised (≥ 25 %: Skin Corr. 1B, "
                + "STOT SE 3) plus the supplier's H290, from memory.",
        },
        new()
        {
            Id = "hcl-0.1m", Name = "hydrochloric acid 0.1 mol/L", Formula = "HCl", Role = ReagentRole.Catalyst,
            AssayPct = 100 * Hcl01MMassFraction,
            Constituents = [new SolutionConstituent("H2O", 1 - Hcl01MMassFraction, ReagentRole.Water)],
            Density = DiluteAqueous.Density(Hcl01MDensity20CGPerMl),
            GhsHazards = ["H290"],
            Source = "Made up by molarity: w = 0.1 mol/L × 36.458 g/mol / 1000.0 g/L = 0.36458 wt % (C). Density 1.0000 g/mL "
                + "at 20 °C from memory (CRC-type table); other temperatures follow water (Tanaka 2001, §5 V) with the same "
                + "increment (estimate). GHS: many SDSs give only H290 at this strength, some none (from memory).",
        },
        new()
        {
            Id = "hno3-68", Name = "nitric acid 68 %", Formula = "HNO3", Role = ReagentRole.Catalyst, AssayPct = 68,
            Constituents = [new SolutionConstituent("H2O", 0.32, ReagentRole.Water)],
            Density = new LinearDensity(1.4048, 20, -0.0011),
            GhsHazards = ["H272", "H290", "H314", "H331"],
            Source = "M(HNO3) 63.012 g/mol (§7). Density 1.4048 g/mL at 20 °C (§7 V, Perry 6th ed. table); dρ/dT −0.0011 "
                + "g/mL/K estimate. Water 32 % by difference. GHS: EU harmonised H272 (≥ 65 %) and H314; H290 and H331 as "
                + "suppliers label 65–70 % acid (plus EUH071, not a GHS code), from memory.",
        },
        new()
        {
            Id = "nh3-28", Name = "ammonia solution 28 %", Formula = "NH3", Role = ReagentRole.Catalyst, AssayPct = 28,
            Constituents = [new SolutionConstituent("H2O", 0.72, ReagentRole.Water)],
            Density = new LinearDensity(0.898, 20, -0.0010),
            GhsHazards = ["H314", "H335", "H400"],
            Source = "M(NH3) 17.031 g/mol (§7). Density 0.898 g/mL at 20 °C (CRC, §7 M), inside the V2 bracket of old "
                + "specific-gravity tables (0.896 at 28.1 %, 60 °F; 0.90 in a reagent table); dρ/dT −0.0010 g/mL/K estimate. "
                + "Water 72 % by difference. GHS: EU harmonised entry for ammonia solution ≥ 25 %, from memory.",
        },
        new()
        {
            Id = "nh3-1m", Name = "ammonia solution 1 mol/L", Formula = "NH3", Role = ReagentRole.Catalyst,
            AssayPct = 100 * Nh31MMassFraction,
            Constituents = [new SolutionConstituent("H2O", 1 - Nh31MMassFraction, ReagentRole.Water)],
            Density = DiluteAqueous.Density(Nh31MDensity20CGPerMl),
            GhsHazards = ["H315", "H319"],
            Source = "Made up by molarity: w = 1 mol/L × 17.031 g/mol / 990.7 g/L = 1.7191 wt % (C). Density 0.9907 g/mL at "
                + "20 °C from memory (CRC-type table); other temperatures follow water (Tanaka 2001, §5 V) with the same "
                + "increment (estimate). GHS: from memory, by the generic limits for a corrosive at 1–5 %; some SDSs do not "
                + "classify it.",
        },
        new()
        {
            Id = "nh4f", Name = "ammonium fluoride (solid)", Formula = "NH4F", Role = ReagentRole.Catalyst, IsSolid = true,
            Density = new LinearDensity(1.01, 20, 0),
            GhsHazards = ["H301", "H311", "H331"],
            Source = "M 37.037 g/mol (§7 C). A solid: weighed, never dosed by volume. Crystal density 1.01 g/mL from memory "
                + "(handbook ~1.01–1.02), used only for its share of the ideal-mixing volume, which it overstates since it "
                + "dissolves; no thermal expansion modelled. Usually added as an aqueous solution made up on site. GHS: EU "
                + "harmonised entry for ammonium fluoride (Acute Tox. 3 by all routes), from memory.",
        },
    ];
}
