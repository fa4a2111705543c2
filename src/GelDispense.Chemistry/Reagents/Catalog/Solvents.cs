namespace GelDispense.Chemistry.Reagents.Catalog;

/// <summary>
/// Solvents and water. Where published-values §7 gives densities at two temperatures the coefficient is their
/// slope (C); the ethanol coefficient is the published one (V). Validity is set to 10–40 °C, a little beyond the
/// 10–30 °C the ethanol table covers; over 10 K the linear form is good to a few 10⁻⁴ g/mL.
/// </summary>
internal static class Solvents
{
    public static IReadOnlyList<Reagent> All { get; } =
    [
        new()
        {
            Id = "ethanol", Name = "ethanol, absolute", Formula = "C2H5OH", Role = ReagentRole.Solvent,
            Density = new LinearDensity(0.7893, 20, -0.00086),
            GhsHazards = ["H225", "H319"],
            Source = "M 46.069 g/mol (§7 V). Density 0.7893 g/mL at 20 °C and 0.7850 at 25 °C (§7 V); dρ/dT −0.00086 g/mL/K "
                + "from the 10–30 °C ethanol table (§7 V). GHS: H225 is the EU harmonised entry; H319 the usual supplier "
                + "self-classification (from memory).",
        },
        new()
        {
            Id = "methanol", Name = "methanol", Formula = "CH3OH", Role = ReagentRole.Solvent,
            Density = new LinearDensity(0.7866, 25, -0.00096),
            GhsHazards = ["H225", "H301", "H311", "H331", "H370"],
            Source = "M 32.042 g/mol (§7 V). Density 0.7866 g/mL at 25 °C (§7 V); dρ/dT −0.00096 g/mL/K, slope to 0.7914 at "
                + "20 °C (CRC, §7 M/V2) (C). GHS: EU harmonised entry (toxic by all routes, damages the optic nerve), from memory.",
        },
        new()
        {
            Id = "1-propanol", Name = "1-propanol", Formula = "CH3CH2CH2OH", Role = ReagentRole.Solvent,
            Density = new LinearDensity(0.8035, 20, -0.00076),
            GhsHazards = ["H225", "H318", "H336"],
            Source = "M 60.096 g/mol (§7). Density 0.8035 g/mL at 20 °C and 0.7997 at 25 °C (§7 M, from memory); dρ/dT "
                + "−0.00076 g/mL/K is their slope. GHS: EU harmonised entry, from memory.",
        },
        new()
        {
            Id = "2-propanol", Name = "2-propanol (isopropanol)", Formula = "(CH3)2CHOH", Role = ReagentRole.Solvent,
            Density = new LinearDensity(0.7855, 20, -0.00092),
            GhsHazards = ["H225", "H319", "H336"],
            Source = "M 60.096 g/mol (§7). Density 0.7855 g/mL at 20 °C and 0.7809 at 25 °C (§7 M; a secondary source gives "
                + "0.786 at 20); dρ/dT −0.00092 g/mL/K is their slope. GHS: EU harmonised entry, matching a supplier SDS "
                + "(Flam. Liq. 2, Eye Irrit. 2, STOT SE 3).",
        },
        new()
        {
            Id = "acetone", Name = "acetone", Formula = "(CH3)2CO", Role = ReagentRole.Solvent,
            Density = new LinearDensity(0.7845, 25, -0.0011),
            GhsHazards = ["H225", "H319", "H336"],
            Source = "M 58.080 g/mol (§7). Density 0.7845 g/mL at 25 °C (§7 V); dρ/dT −0.0011 g/mL/K (§7 M, from 0.7899 at "
                + "20 °C). GHS: EU harmonised entry (plus EUH066, not a GHS code), from memory.",
        },
        new()
        {
            Id = "water", Name = "water, deionised", Formula = "H2O", Role = ReagentRole.Water,
            Density = WaterDensityModel.Instance,
            Source = "M 18.015 g/mol (§7). Density by Tanaka et al. 2001, Metrologia 38, 301 (§5 V), 0–40 °C; air-free, which "
                + "differs from air-saturated water by a few ppm (from memory). Not classified under GHS.",
        },
    ];
}
