using GelDispense.Chemistry.Reagents;

namespace GelDispense.Chemistry.Tests.Support;

/// <summary>
/// Reagents with the numbers written out here, so composition tests do not move when the catalog is refined.
/// Densities: TEOS 0.933 g/mL at 20 °C, ethanol 0.7893 at 20 °C (published-values §7, V), 2-propanol 0.7855
/// (from memory), 37 % HCl 1.184 at 20 °C (V, interpolated table); water by Tanaka 2001.
/// </summary>
internal static class TestReagents
{
    public static readonly Reagent Teos = new()
    {
        Id = "t-teos", Name = "TEOS", Formula = "Si(OC2H5)4", Role = ReagentRole.Precursor,
        Density = new LinearDensity(0.933, 20, -0.00095),
        Precursor = new PrecursorData("SiO2", 1, 4, 2.2, "C2H5OH"),
    };

    public static readonly Reagent Mtms = new()
    {
        Id = "t-mtms", Name = "MTMS", Formula = "CH3Si(OCH3)3", Role = ReagentRole.Precursor,
        Density = new LinearDensity(0.955, 25, -0.001),
        Precursor = new PrecursorData("CH3SiO1.5", 1, 3, 1.3, "CH3OH"),
    };

    public static readonly Reagent Ttip = new()
    {
        Id = "t-ttip", Name = "TTIP", Formula = "Ti(OC3H7)4", Role = ReagentRole.Precursor,
        Density = new LinearDensity(0.96, 20, -0.001),
        Precursor = new PrecursorData("TiO2", 1, 4, 3.8, "C3H7OH"),
    };

    public static readonly Reagent Ethanol = new()
    {
        Id = "t-ethanol", Name = "ethanol", Formula = "C2H5OH", Role = ReagentRole.Solvent,
        Density = new LinearDensity(0.7893, 20, -0.00086),
    };

    public static readonly Reagent Isopropanol = new()
    {
        Id = "t-2-propanol", Name = "2-propanol", Formula = "C3H7OH", Role = ReagentRole.Solvent,
        Density = new LinearDensity(0.7855, 20, -0.00085),
    };

    public static readonly Reagent Water = new()
    {
        Id = "t-water", Name = "water", Formula = "H2O", Role = ReagentRole.Water, Density = WaterDensityModel.Instance,
    };

    public static readonly Reagent Hcl37 = new()
    {
        Id = "t-hcl-37", Name = "hydrochloric acid 37 %", Formula = "HCl", Role = ReagentRole.Catalyst, AssayPct = 37,
        Density = new LinearDensity(1.184, 20, -0.0005),
        Constituents = [new SolutionConstituent("H2O", 0.63, ReagentRole.Water)],
        GhsHazards = ["H290", "H314", "H335"],
    };

    public static ReagentCatalog Catalog() => new([Teos, Mtms, Ttip, Ethanol, Isopropanol, Water, Hcl37]);
}
