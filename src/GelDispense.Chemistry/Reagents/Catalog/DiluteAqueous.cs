using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Reagents.Catalog;

/// <summary>
/// Helpers for dilute aqueous solutions made up by molarity, whose density follows water's curve offset by the
/// solute's small increment. The increment is taken as constant over 10–40 °C (an estimate; it changes by far less
/// than water's own density does over that span).
/// </summary>
internal static class DiluteAqueous
{
    private const double IncrementReferenceTemperatureC = 20;

    /// <summary>Mass fraction from molarity: w = c·M / (1000 mL/L · ρ), with ρ the solution's density.</summary>
    public static double MassFraction(double molPerL, double molarMassGPerMol, double solutionDensityGPerMl) =>
        molPerL * molarMassGPerMol / (1000 * solutionDensityGPerMl);

    /// <summary>
    /// Water by Tanaka 2001 plus the increment that makes the solution weigh <paramref name="densityAt20CGPerMl"/>
    /// at 20 °C, tabulated every 5 K from 10 to 40 °C (linear interpolation between nodes adds under 4·10⁻⁵ g/mL, worst near 10 °C).
    /// </summary>
    public static TabulatedDensity Density(double densityAt20CGPerMl)
    {
        var incrementGPerMl = densityAt20CGPerMl - WaterDensity.Tanaka2001GPerMl(IncrementReferenceTemperatureC);
        return new TabulatedDensity(Enumerable.Range(0, 7)
            .Select(i => 10.0 + (5.0 * i))
            .Select(t => (t, WaterDensity.Tanaka2001GPerMl(t) + incrementGPerMl)));
    }
}
