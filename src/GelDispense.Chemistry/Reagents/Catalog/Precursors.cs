namespace GelDispense.Chemistry.Reagents.Catalog;

/// <summary>
/// Alkoxide precursors. Molar masses come from the formulas (IUPAC weights, published-values §7/§8).
/// Status letters in <see cref="Reagent.Source"/> are those of published-values.md: V confirmed, V2 confirmed
/// through a secondary source, C calculated, M from memory. "Estimate" marks a number chosen here.
/// Temperature coefficients of the alkoxides are not in any source at hand: −0.0010 g/mL/K is an estimate,
/// the order of magnitude of organic liquids near room temperature (ethanol −0.00086, acetone −0.0011).
/// </summary>
internal static class Precursors
{
    private const double AlkoxideCoefficientEstimateGPerMlPerK = -0.0010;

    public static IReadOnlyList<Reagent> All { get; } =
    [
        new()
        {
            Id = "teos", Name = "tetraethyl orthosilicate (TEOS)", Formula = "Si(OC2H5)4", Role = ReagentRole.Precursor,
            Density = new LinearDensity(0.933, 20, AlkoxideCoefficientEstimateGPerMlPerK),
            Precursor = new PrecursorData("SiO2", 1, 4, 2.2, "C2H5OH"),
            GhsHazards = ["H226", "H319", "H332", "H335"],
            Source = "M 208.33 g/mol (§7 V). Density 0.933 g/mL at 20 °C (§7 V, encyclopedic data); dρ/dT estimate. "
                + "SiO2 1 per mol, 4 groups: Si(OR)4 + 2 H2O → SiO2 + 4 ROH (§9 V). Skeletal density 2.2 g/mL, vitreous silica "
                + "(§7 M; used as ρs for sol-gel silica: V2). GHS: EU CLP harmonised entry, from memory.",
        },
        new()
        {
            Id = "tmos", Name = "tetramethyl orthosilicate (TMOS)", Formula = "Si(OCH3)4", Role = ReagentRole.Precursor,
            Density = new LinearDensity(1.032, 25, AlkoxideCoefficientEstimateGPerMlPerK),
            Precursor = new PrecursorData("SiO2", 1, 4, 2.2, "CH3OH"),
            GhsHazards = ["H226", "H315", "H318", "H330", "H335"],
            Source = "M 152.22 g/mol, not 152.25 (§7 V). Density 1.032 g/mL at 25 °C (§7 V); dρ/dT estimate. SiO2 as for TEOS; "
                + "skeletal density 2.2 g/mL (§7 M/V2). GHS: H330 fits a supplier SDS's rat LC50 of 0.39 mg/L (vapour, 4 h), "
                + "H318 and H315 its eye ('risk of blindness') and skin findings; H226 and H335 from memory. Japan's NITE "
                + "classification gives H225 (flash point 20 °C closed cup): treat the liquid as highly flammable.",
        },
        new()
        {
            Id = "mtms", Name = "methyltrimethoxysilane (MTMS)", Formula = "CH3Si(OCH3)3", Role = ReagentRole.Precursor,
            Density = new LinearDensity(0.955, 25, AlkoxideCoefficientEstimateGPerMlPerK),
            Precursor = new PrecursorData("CH3SiO1.5", 1, 3, MethylsilsesquioxaneSkeletalDensityGPerMl, "CH3OH"),
            GhsHazards = ["H225"],
            Source = "M 136.22 g/mol (§7 V). Density 0.955 g/mL at 25 °C (§7 V); dρ/dT estimate. CH3SiO1.5 1 per mol (methyl kept), "
                + "3 groups (§9 C: 67.12 g oxide per mol). " + MethylsilsesquioxaneNote + " GHS: from memory.",
        },
        new()
        {
            Id = "mtes", Name = "methyltriethoxysilane (MTES)", Formula = "CH3Si(OC2H5)3", Role = ReagentRole.Precursor,
            Density = new LinearDensity(0.895, 25, AlkoxideCoefficientEstimateGPerMlPerK),
            Precursor = new PrecursorData("CH3SiO1.5", 1, 3, MethylsilsesquioxaneSkeletalDensityGPerMl, "C2H5OH"),
            GhsHazards = ["H226"],
            Source = "M 178.30 g/mol (§7, M verified). Density 0.895 g/mL at 25 °C (§7 M, from memory); dρ/dT estimate. "
                + "CH3SiO1.5 1 per mol, 3 groups. " + MethylsilsesquioxaneNote + " GHS: from memory.",
        },
        new()
        {
            Id = "ttip", Name = "titanium(IV) isopropoxide (TTIP)", Formula = "Ti(OCH(CH3)2)4", Role = ReagentRole.Precursor,
            Density = new LinearDensity(0.96, 20, AlkoxideCoefficientEstimateGPerMlPerK),
            Precursor = new PrecursorData("TiO2", 1, 4, AmorphousTitaniaSkeletalDensityGPerMl, "C3H7OH"),
            GhsHazards = ["H226", "H319", "H336"],
            Source = "M 284.22 g/mol (§7 V). Density 0.96 g/mL at 20 °C (§7 V); dρ/dT estimate. " + AmorphousTitaniaNote
                + " Releases 2-propanol. GHS: from memory.",
        },
        new()
        {
            Id = "tbot", Name = "titanium(IV) n-butoxide", Formula = "Ti(OC4H9)4", Role = ReagentRole.Precursor,
            Density = new LinearDensity(0.998, 25, AlkoxideCoefficientEstimateGPerMlPerK),
            Precursor = new PrecursorData("TiO2", 1, 4, AmorphousTitaniaSkeletalDensityGPerMl, "C4H9OH"),
            GhsHazards = ["H226", "H315", "H318", "H335", "H336"],
            Source = "M 340.33 g/mol (§7 V). Density 0.998 g/mL at 25 °C (§7 V); dρ/dT estimate. " + AmorphousTitaniaNote
                + " Releases 1-butanol. GHS: from memory.",
        },
        new()
        {
            Id = "zr-npropoxide-70", Name = "zirconium(IV) n-propoxide, 70 wt % in 1-propanol", Formula = "Zr(OC3H7)4",
            Role = ReagentRole.Precursor, AssayPct = 70,
            Constituents = [new SolutionConstituent("C3H7OH", 0.30, ReagentRole.Solvent)],
            Density = new LinearDensity(1.044, 25, AlkoxideCoefficientEstimateGPerMlPerK),
            Precursor = new PrecursorData("ZrO2", 1, 4, 5.68, "C3H7OH"),
            GhsHazards = ["H225", "H318", "H335", "H336"],
            Source = "M 327.57 g/mol of the pure alkoxide with Zr 91.222 (2024 CIAAW; §7 lists 327.58, V2). Density 1.044 g/mL at "
                + "25 °C (§7 V2); dρ/dT estimate. §7 also gives 1.058 at 20 °C (V2), which would mean −0.0028 g/mL/K, three "
                + "times that of 1-propanol: taken as vendor-to-vendor spread (0.9 %), not as the coefficient. Balance 30 % "
                + "1-propanol by difference. ZrO2 skeletal density 5.68 g/mL, monoclinic (§7 M); an amorphous gel skeleton is "
                + "lighter. GHS: from memory (the solution carries 1-propanol's H225/H318/H336).",
        },
        new()
        {
            Id = "al-sbutoxide", Name = "aluminium tri-sec-butoxide", Formula = "Al(OCH(CH3)C2H5)3", Role = ReagentRole.Precursor,
            Density = new LinearDensity(0.96, 25, AlkoxideCoefficientEstimateGPerMlPerK),
            Precursor = new PrecursorData("AlO1.5", 1, 3, 3.6, "C4H9OH"),
            GhsHazards = ["H226", "H315", "H318", "H335", "H336"],
            Source = "M 246.33 g/mol (§7 C). Density 0.96 g/mL at 25 °C (§7 M, from memory); dρ/dT estimate. AlO1.5 (half an "
                + "Al2O3) 1 per mol, 3 groups; releases 2-butanol. Skeletal density 3.6 g/mL, γ-alumina (§7 M). GHS: from memory "
                + "and deliberately broad (the alkoxide's eye damage plus the 2-butanol it releases); check the supplier SDS.",
        },
    ];

    /// <summary>From memory: methylsilsesquioxane gel skeletons measure about 1.3 g/mL by helium pycnometry.</summary>
    private const double MethylsilsesquioxaneSkeletalDensityGPerMl = 1.3;

    private const string MethylsilsesquioxaneNote =
        "Skeletal density 1.3 g/mL for methylsilsesquioxane: from memory (He pycnometry on such gels, roughly 1.2–1.5), not confirmed.";

    /// <summary>Estimate: the midpoint of the ~3.0–3.8 g/mL that published-values §7 gives (M) for amorphous titania.</summary>
    private const double AmorphousTitaniaSkeletalDensityGPerMl = 3.4;

    private const string AmorphousTitaniaNote =
        "TiO2 1 per mol, 4 groups. Skeletal density 3.4 g/mL for amorphous TiO2, the state of an uncalcined gel: estimate, "
        + "midpoint of ~3.0–3.8 (§7 M); anatase would be 3.78–3.9 (§7 V).";
}
