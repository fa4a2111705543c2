namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// The CIPM-2007 moist-air equation in SI units, unguarded; <see cref="AirDensity"/> checks the
/// inputs. Constants from Picard, Davis, Gläser and Fujii, Metrologia 45 (2008) 149.
/// </summary>
internal static class Cipm2007Air
{
    private const double GasConstantJPerMolK = 8.314472;
    private const double WaterMolarMassKgPerMol = 18.01528e-3;

    // Saturation vapour pressure psv = exp(A T² + B T + C + D/T), Pa.
    private const double PsvA = 1.2378847e-5;
    private const double PsvB = -1.9121316e-2;
    private const double PsvC = 33.93711047;
    private const double PsvD = -6.3431645e3;

    // Compressibility factor coefficients.
    private const double A0 = 1.58123e-6;
    private const double A1 = -2.9331e-8;
    private const double A2 = 1.1043e-10;
    private const double B0 = 5.707e-6;
    private const double B1 = -2.051e-8;
    private const double C0 = 1.9898e-4;
    private const double C1 = -2.376e-6;
    private const double D = 1.83e-11;
    private const double E = -0.765e-8;

    public static double DensityKgPerM3(double temperatureC, double pressurePa, double humidityFraction, double co2MoleFraction)
    {
        var t = temperatureC;
        var temperatureK = t + 273.15;
        var p = pressurePa;

        // Dry-air molar mass grows with CO2 that replaces O2.
        var airMolarMassKgPerMol = (28.96546 + (12.011 * (co2MoleFraction - 0.0004))) * 1e-3;
        var saturationPa = Math.Exp((PsvA * temperatureK * temperatureK) + (PsvB * temperatureK) + PsvC + (PsvD / temperatureK));
        var enhancement = 1.00062 + (3.14e-8 * p) + (5.6e-7 * t * t);
        var xv = humidityFraction * enhancement * saturationPa / p;

        var compressibility = 1
            - (p / temperatureK * (A0 + (A1 * t) + (A2 * t * t) + ((B0 + (B1 * t)) * xv) + ((C0 + (C1 * t)) * xv * xv)))
            + (p * p / (temperatureK * temperatureK) * (D + (E * xv * xv)));

        return p * airMolarMassKgPerMol / (compressibility * GasConstantJPerMolK * temperatureK)
            * (1 - (xv * (1 - (WaterMolarMassKgPerMol / airMolarMassKgPerMol))));
    }
}
