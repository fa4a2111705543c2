namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// Moist-air density from temperature, pressure and humidity. The accepted domain (0–40 °C,
/// 500–1200 hPa, 0–100 % RH) is wider than the ranges the formulas were fitted for (R 111
/// approximation: 10–30 °C, 900–1100 hPa, hr &lt; 80 %; CIPM-2007: 15–27 °C, 600–1100 hPa; both from
/// memory): outside those the uncertainty grows but the result stays physical, which is enough for a
/// buoyancy correction of about 10⁻³. Inputs outside the domain are rejected because they are far
/// more likely unit mistakes (kPa for hPa, a fraction for a percentage) than real laboratory air.
/// </summary>
public static class AirDensity
{
    /// <summary>Air density of OIML D 28 conventional mass, kg/m³.</summary>
    public const double ConventionalKgPerM3 = 1.2;

    public const double MinTemperatureC = 0;
    public const double MaxTemperatureC = 40;
    public const double MinPressureHpa = 500;
    public const double MaxPressureHpa = 1200;
    public const double MaxCo2MoleFraction = 0.01;

    private const double KelvinOffset = 273.15;

    /// <summary>
    /// OIML R 111-1:2004 Annex E, eq. E.3-1: ρa = (0.34848·p − 0.009·hr·exp(0.061·t)) / (273.15 + t).
    /// With Tanaka water it reproduces the ISO 8655-6 Z-factor table (see <see cref="ZFactor"/>).
    /// </summary>
    /// <param name="temperatureC">Air temperature, °C.</param>
    /// <param name="pressureHpa">Pressure, hPa.</param>
    /// <param name="relativeHumidityPct">Relative humidity, %.</param>
    /// <returns>Air density, kg/m³.</returns>
    public static double OimlR111ApproximationKgPerM3(double temperatureC, double pressureHpa, double relativeHumidityPct)
    {
        GuardCommon(temperatureC, pressureHpa, relativeHumidityPct);
        return ((0.34848 * pressureHpa) - (0.009 * relativeHumidityPct * Math.Exp(0.061 * temperatureC)))
            / (KelvinOffset + temperatureC);
    }

    /// <summary>
    /// CIPM-2007 equation (Picard, Davis, Gläser, Fujii, Metrologia 45 (2008) 149):
    /// ρa = p·Ma/(Z·R·T)·[1 − xv(1 − Mv/Ma)], with the saturation vapour pressure, enhancement factor
    /// and compressibility of that paper (see <see cref="Cipm2007Air"/>).
    /// </summary>
    /// <param name="temperatureC">Air temperature, °C.</param>
    /// <param name="pressureHpa">Pressure, hPa.</param>
    /// <param name="relativeHumidityPct">Relative humidity, %.</param>
    /// <param name="co2MoleFraction">CO2 mole fraction, 0.0004 = 400 ppm.</param>
    /// <returns>Air density, kg/m³.</returns>
    public static double Cipm2007KgPerM3(
        double temperatureC, double pressureHpa, double relativeHumidityPct, double co2MoleFraction = 0.0004)
    {
        GuardCommon(temperatureC, pressureHpa, relativeHumidityPct);
        ArgumentGuard.InRange(co2MoleFraction, 0, MaxCo2MoleFraction, nameof(co2MoleFraction));
        return Cipm2007Air.DensityKgPerM3(temperatureC, pressureHpa * 100, relativeHumidityPct / 100, co2MoleFraction);
    }

    /// <summary>The density of <paramref name="air"/> with the model it names, kg/m³.</summary>
    public static double KgPerM3(AirConditions air)
    {
        ArgumentNullException.ThrowIfNull(air);
        return air.Model switch
        {
            AirDensityModel.OimlR111Approximation =>
                OimlR111ApproximationKgPerM3(air.TemperatureC, air.PressureHpa, air.RelativeHumidityPct),
            AirDensityModel.Cipm2007 =>
                Cipm2007KgPerM3(air.TemperatureC, air.PressureHpa, air.RelativeHumidityPct, air.Co2MoleFraction),
            _ => throw new ArgumentOutOfRangeException(nameof(air), air.Model, "unknown air-density model"),
        };
    }

    private static void GuardCommon(double temperatureC, double pressureHpa, double relativeHumidityPct)
    {
        ArgumentGuard.InRange(temperatureC, MinTemperatureC, MaxTemperatureC, nameof(temperatureC));
        ArgumentGuard.InRange(pressureHpa, MinPressureHpa, MaxPressureHpa, nameof(pressureHpa));
        ArgumentGuard.InRange(relativeHumidityPct, 0, 100, nameof(relativeHumidityPct));
    }
}
