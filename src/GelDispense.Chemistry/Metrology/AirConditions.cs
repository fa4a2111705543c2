using GelDispense.Chemistry.Errors;

namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// The air around a balance: what the buoyancy correction needs. The defaults are a typical
/// laboratory (20 °C, 1013.25 hPa, 50 % RH, 400 ppm CO2) evaluated with CIPM-2007.
/// </summary>
/// <param name="TemperatureC">Air temperature, °C.</param>
/// <param name="PressureHpa">Barometric pressure at the balance (not reduced to sea level), hPa.</param>
/// <param name="RelativeHumidityPct">Relative humidity, %.</param>
/// <param name="Co2MoleFraction">CO2 mole fraction (0.0004 = 400 ppm); only CIPM-2007 uses it.</param>
/// <param name="Model">The air-density formula.</param>
public sealed record AirConditions(
    double TemperatureC = 20,
    double PressureHpa = 1013.25,
    double RelativeHumidityPct = 50,
    double Co2MoleFraction = 0.0004,
    AirDensityModel Model = AirDensityModel.Cipm2007)
{
    /// <summary>The default laboratory air; its density is about 1.1993 kg/m³.</summary>
    public static AirConditions Standard { get; } = new();

    /// <summary>
    /// Every problem with these conditions, checked against the domain <see cref="AirDensity"/> accepts.
    /// </summary>
    /// <param name="field">Path of this record in the request, used as the prefix of each field.</param>
    public IReadOnlyList<InputError> Validate(string field = "air")
    {
        var errors = new List<InputError>();
        InputChecks.InRange(errors, $"{field}.temperatureC", TemperatureC, AirDensity.MinTemperatureC, AirDensity.MaxTemperatureC);
        InputChecks.InRange(errors, $"{field}.pressureHpa", PressureHpa, AirDensity.MinPressureHpa, AirDensity.MaxPressureHpa);
        InputChecks.InRange(errors, $"{field}.relativeHumidityPct", RelativeHumidityPct, 0, 100);
        InputChecks.InRange(errors, $"{field}.co2MoleFraction", Co2MoleFraction, 0, AirDensity.MaxCo2MoleFraction);
        if (!Enum.IsDefined(Model))
        {
            errors.Add(new InputError($"{field}.model", Model.ToString(), "is not a known air-density model"));
        }

        return errors;
    }
}
