namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// ISO 8655-6 conversion factor from the mass of water delivered to its volume:
/// Z = [1/(ρw − ρa)]·(1 − ρa/ρb), V = m·Z, with ρb = 8000 kg/m³ the density of the balance's
/// reference weights (formula as named in EURAMET cg-19 and Acta IMEKO 10(3) 2021). Water is
/// Tanaka 2001 and air the OIML R 111 approximation, the combination that reproduces the published
/// ISO table to its 0.0001 rounding. The table assumes the water and the air share one temperature.
/// </summary>
public static class ZFactor
{
    /// <summary>Z in µL/mg (numerically mL/g).</summary>
    /// <param name="temperatureC">Water and air temperature, °C, 0–40.</param>
    /// <param name="pressureHpa">Barometric pressure, hPa.</param>
    /// <param name="relativeHumidityPct">Relative humidity, %; the ISO table is computed at 50 %.</param>
    public static double MicrolitresPerMilligram(double temperatureC, double pressureHpa, double relativeHumidityPct = 50)
    {
        var waterGPerMl = WaterDensity.Tanaka2001GPerMl(temperatureC);
        var airGPerMl = AirDensity.OimlR111ApproximationKgPerM3(temperatureC, pressureHpa, relativeHumidityPct) / 1000;
        var weightsGPerMl = Buoyancy.ReferenceWeightDensityKgPerM3 / 1000;
        return 1 / (waterGPerMl - airGPerMl) * (1 - (airGPerMl / weightsGPerMl));
    }
}
