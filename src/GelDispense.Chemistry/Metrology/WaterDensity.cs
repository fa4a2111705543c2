namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// Density of air-free pure water at 101.325 kPa. Tanaka is the CIPM-recommended formula and the one
/// every other calculation in this library uses; Kell is kept as an independent cross-check.
/// </summary>
public static class WaterDensity
{
    /// <summary>Lowest temperature of the Tanaka 2001 fit, °C.</summary>
    public const double MinTemperatureC = 0;

    /// <summary>Highest temperature of the Tanaka 2001 fit, °C.</summary>
    public const double MaxTemperatureC = 40;

    /// <summary>
    /// Highest temperature accepted by <see cref="Kell1975KgPerM3"/>, °C. Kell's fit reaches 150 °C
    /// (from memory), but at 101.325 kPa water boils at 100 °C, so liquid water ends there.
    /// </summary>
    public const double KellMaxTemperatureC = 100;

    private const double TanakaA1C = -3.983035;
    private const double TanakaA2C = 301.797;
    private const double TanakaA3C2 = 522528.9;
    private const double TanakaA4C = 69.34881;
    private const double TanakaA5KgPerM3 = 999.974950;

    /// <summary>
    /// Tanaka, Girard, Davis, Peuto and Bignell, Metrologia 38 (2001) 301, the CIPM formula for
    /// SMOW: ρ = a5·[1 − (t + a1)²(t + a2) / (a3(t + a4))], valid 0–40 °C.
    /// </summary>
    /// <param name="temperatureC">Water temperature on ITS-90, °C, 0–40.</param>
    /// <returns>Density in kg/m³.</returns>
    public static double Tanaka2001KgPerM3(double temperatureC)
    {
        ArgumentGuard.InRange(temperatureC, MinTemperatureC, MaxTemperatureC, nameof(temperatureC));
        var t = temperatureC;
        return TanakaA5KgPerM3 * (1 - ((t + TanakaA1C) * (t + TanakaA1C) * (t + TanakaA2C)
            / (TanakaA3C2 * (t + TanakaA4C))));
    }

    /// <summary>Tanaka 2001 density in g/mL (numerically g/cm³), for mass ↔ volume conversions.</summary>
    /// <param name="temperatureC">Water temperature, °C, 0–40.</param>
    public static double Tanaka2001GPerMl(double temperatureC) => Tanaka2001KgPerM3(temperatureC) / 1000;

    /// <summary>
    /// Kell, J. Chem. Eng. Data 20 (1975) 97, the IPTS-68 fit:
    /// ρ = (999.83952 + 16.945176 t − 7.9870401e-3 t² − 46.170461e-6 t³ + 105.56302e-9 t⁴
    /// − 280.54253e-12 t⁵) / (1 + 16.879850e-3 t). The denominator 16.897850e-3 printed in one
    /// reprint is a typo (it gives 997.94 kg/m³ at 20 °C). The IPTS-68 vs ITS-90 offset is
    /// not applied: t68 − t90 is a few mK near room temperature (from memory), about 10⁻³ kg/m³.
    /// </summary>
    /// <param name="temperatureC">Water temperature, °C, 0–100.</param>
    /// <returns>Density in kg/m³.</returns>
    public static double Kell1975KgPerM3(double temperatureC)
    {
        ArgumentGuard.InRange(temperatureC, MinTemperatureC, KellMaxTemperatureC, nameof(temperatureC));
        var t = temperatureC;
        var numerator = 999.83952 + (t * (16.945176 + (t * (-7.9870401e-3 + (t * (-46.170461e-6
            + (t * (105.56302e-9 + (t * -280.54253e-12)))))))));
        return numerator / (1 + (16.879850e-3 * t));
    }
}
