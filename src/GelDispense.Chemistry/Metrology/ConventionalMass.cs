namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// OIML D 28:2004 conventional mass: the mass of a reference weight of 8000 kg/m³ that balances the
/// body at 20 °C in air of 1.2 kg/m³, m_c = m·(1 − 1.2/ρ)/(1 − 1.2/8000). That is exactly what a
/// balance adjusted with conventional-mass weights reads in air of 1.2 kg/m³, so both directions
/// are the buoyancy correction at <see cref="AirDensity.ConventionalKgPerM3"/>.
/// </summary>
public static class ConventionalMass
{
    /// <summary>Conventional mass of a body of true mass <paramref name="trueMassG"/>, g.</summary>
    /// <param name="trueMassG">True mass, g.</param>
    /// <param name="densityGPerMl">Density of the body at 20 °C, g/mL.</param>
    public static double FromTrueMassG(double trueMassG, double densityGPerMl) =>
        Buoyancy.ReadingFromTrueMassG(trueMassG, densityGPerMl, AirDensity.ConventionalKgPerM3);

    /// <summary>True mass of a body whose conventional mass is <paramref name="conventionalMassG"/>, g.</summary>
    /// <param name="conventionalMassG">Conventional mass, g.</param>
    /// <param name="densityGPerMl">Density of the body at 20 °C, g/mL.</param>
    public static double ToTrueMassG(double conventionalMassG, double densityGPerMl) =>
        Buoyancy.TrueMassFromReadingG(conventionalMassG, densityGPerMl, AirDensity.ConventionalKgPerM3);
}
