using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Reagents;

/// <summary>Pure, air-free water by the Tanaka et al. 2001 formula (Metrologia 38, 301), valid 0–40 °C.</summary>
public sealed record WaterDensityModel : DensityModel
{
    public static WaterDensityModel Instance { get; } = new();

    public override double MinTemperatureC => WaterDensity.MinTemperatureC;

    public override double MaxTemperatureC => WaterDensity.MaxTemperatureC;

    public override double DensityGPerMl(double temperatureC) => WaterDensity.Tanaka2001GPerMl(temperatureC);
}
