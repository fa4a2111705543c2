namespace GelDispense.Chemistry.Reagents;

/// <summary>ρ(T) = ρ_ref + k·(T − T_ref), the usual handbook form for organic liquids near room temperature.</summary>
public sealed record LinearDensity(
    double ReferenceDensityGPerMl,
    double ReferenceTemperatureC,
    double CoefficientGPerMlPerK,
    double MinTemperatureCValue = 10,
    double MaxTemperatureCValue = 40) : DensityModel
{
    public override double MinTemperatureC => MinTemperatureCValue;

    public override double MaxTemperatureC => MaxTemperatureCValue;

    public override double DensityGPerMl(double temperatureC) =>
        ReferenceDensityGPerMl + CoefficientGPerMlPerK * (temperatureC - ReferenceTemperatureC);
}
