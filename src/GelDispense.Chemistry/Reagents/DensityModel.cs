namespace GelDispense.Chemistry.Reagents;

/// <summary>Density of a reagent as supplied, as a function of temperature, over a stated range of validity.</summary>
public abstract record DensityModel
{
    public abstract double MinTemperatureC { get; }

    public abstract double MaxTemperatureC { get; }

    /// <summary>Density in g/mL; callers check <see cref="Covers"/> first.</summary>
    public abstract double DensityGPerMl(double temperatureC);

    public bool Covers(double temperatureC) =>
        temperatureC >= MinTemperatureC && temperatureC <= MaxTemperatureC;
}
