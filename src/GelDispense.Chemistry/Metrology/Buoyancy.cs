namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// Air-buoyancy correction between a balance reading and true mass. A balance adjusted with steel
/// weights (8000 kg/m³) shows the mass of reference weight that the sample balances in air, so a
/// sample less dense than steel reads light. m = W·(1 − ρa/ρref)/(1 − ρa/ρs), the form of NIST SOP 2
/// and EURAMET cg-18.
/// </summary>
public static class Buoyancy
{
    /// <summary>Density of the reference weights (OIML R 111 / D 28 convention), kg/m³.</summary>
    public const double ReferenceWeightDensityKgPerM3 = 8000;

    /// <summary>
    /// Largest sample density accepted, g/mL. The densest element, osmium, is about 22.6 g/cm³
    /// (CRC handbook, from memory), so a larger figure is almost surely kg/m³ passed as g/mL.
    /// </summary>
    public const double MaxSampleDensityGPerMl = 25;

    /// <summary>
    /// Largest air density accepted, kg/m³: several times any laboratory air, small enough to catch
    /// an air density given in g/m³.
    /// </summary>
    public const double MaxAirDensityKgPerM3 = 10;

    /// <summary>The ratio true mass / reading, m/W = (1 − ρa/8000)/(1 − ρa/ρs).</summary>
    /// <param name="sampleDensityGPerMl">Density of what is on the pan, g/mL.</param>
    /// <param name="airDensityKgPerM3">Density of the air at the balance, kg/m³.</param>
    public static double CorrectionFactor(double sampleDensityGPerMl, double airDensityKgPerM3)
    {
        ArgumentGuard.InRange(airDensityKgPerM3, 0, MaxAirDensityKgPerM3, nameof(airDensityKgPerM3));
        ArgumentGuard.InRange(sampleDensityGPerMl, 0, MaxSampleDensityGPerMl, nameof(sampleDensityGPerMl));
        var sampleDensityKgPerM3 = sampleDensityGPerMl * 1000;
        if (sampleDensityKgPerM3 <= airDensityKgPerM3)
        {
            // A sample no denser than air floats: there is no reading to correct.
            throw new ArgumentOutOfRangeException(
                nameof(sampleDensityGPerMl), sampleDensityGPerMl, "must be denser than the air");
        }

        return (1 - (airDensityKgPerM3 / ReferenceWeightDensityKgPerM3))
            / (1 - (airDensityKgPerM3 / sampleDensityKgPerM3));
    }

    /// <summary>True mass of a sample from what the balance shows, g.</summary>
    /// <param name="readingG">Balance reading (net of tare), g.</param>
    /// <param name="sampleDensityGPerMl">Sample density, g/mL.</param>
    /// <param name="airDensityKgPerM3">Air density, kg/m³.</param>
    public static double TrueMassFromReadingG(double readingG, double sampleDensityGPerMl, double airDensityKgPerM3)
    {
        ArgumentGuard.Finite(readingG, nameof(readingG));
        return readingG * CorrectionFactor(sampleDensityGPerMl, airDensityKgPerM3);
    }

    /// <summary>The reading to aim for so that <paramref name="trueMassG"/> lands on the pan, g.</summary>
    /// <param name="trueMassG">True mass wanted, g.</param>
    /// <param name="sampleDensityGPerMl">Sample density, g/mL.</param>
    /// <param name="airDensityKgPerM3">Air density, kg/m³.</param>
    public static double ReadingFromTrueMassG(double trueMassG, double sampleDensityGPerMl, double airDensityKgPerM3)
    {
        ArgumentGuard.Finite(trueMassG, nameof(trueMassG));
        return trueMassG / CorrectionFactor(sampleDensityGPerMl, airDensityKgPerM3);
    }
}
