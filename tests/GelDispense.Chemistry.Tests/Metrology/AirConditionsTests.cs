using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Tests.Metrology;

public class AirConditionsTests
{
    [Fact]
    public void Standard_is_20_C_1013_25_hPa_50_percent_400_ppm_with_CIPM_2007()
    {
        Assert.Equal(new AirConditions(20, 1013.25, 50, 0.0004, AirDensityModel.Cipm2007), AirConditions.Standard);
        Assert.Empty(AirConditions.Standard.Validate());
    }

    [Fact]
    public void Validate_names_every_bad_field_with_its_value()
    {
        var air = new AirConditions(TemperatureC: 60, PressureHpa: 101.3, RelativeHumidityPct: -5, Co2MoleFraction: 400);

        var errors = air.Validate();

        Assert.Equal(
            ["air.temperatureC", "air.pressureHpa", "air.relativeHumidityPct", "air.co2MoleFraction"],
            errors.Select(e => e.Field));
        Assert.Equal("101.3", errors[1].Value);
        Assert.Contains("500", errors[1].Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Validate_rejects_an_undefined_model_and_uses_the_given_prefix()
    {
        var errors = (AirConditions.Standard with { Model = (AirDensityModel)7 }).Validate("plan.air");

        var error = Assert.Single(errors);
        Assert.Equal("plan.air.model", error.Field);
    }

    [Fact]
    public void Validate_rejects_not_a_number()
    {
        var errors = (AirConditions.Standard with { TemperatureC = double.NaN }).Validate();

        Assert.Equal("air.temperatureC", Assert.Single(errors).Field);
    }
}
