using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Metrology;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Mapping;

/// <summary>Balance, pipette and air between contract and chemistry; the chemistry records validate their own numbers.</summary>
public static class DeviceMapping
{
    public static AirConditions ToChemistry(Contract.AirConditions? air, string field)
    {
        if (air is null)
        {
            return AirConditions.Standard;
        }

        var standard = AirConditions.Standard;
        var conditions = new AirConditions(
            air.HasTemperatureC ? air.TemperatureC : standard.TemperatureC,
            air.HasPressureHpa ? air.PressureHpa : standard.PressureHpa,
            air.HasRelativeHumidityPct ? air.RelativeHumidityPct : standard.RelativeHumidityPct,
            air.HasCo2MoleFraction ? air.Co2MoleFraction : standard.Co2MoleFraction);
        Throw(conditions.Validate(field));
        return conditions;
    }

    public static BalanceProfile ToChemistry(Contract.BalanceProfile? balance, string field)
    {
        if (balance is null)
        {
            throw new InvalidInputException(field, "", "a balance profile is required");
        }

        AccuracyClass? accuracyClass = balance.AccuracyClass.Trim() switch
        {
            "" => null,
            "I" => AccuracyClass.I,
            "II" => AccuracyClass.II,
            "III" => AccuracyClass.III,
            "IIII" => AccuracyClass.IIII,
            _ => throw new InvalidInputException($"{field}.accuracyClass", RecipeMapping.Clip(balance.AccuracyClass), "not an OIML R 76 accuracy class; use I, II, III or IIII"),
        };
        var profile = new BalanceProfile(
            balance.ReadabilityG,
            balance.CapacityG,
            balance.HasRepeatabilityG ? balance.RepeatabilityG : null,
            balance.HasMinimumWeightG ? balance.MinimumWeightG : null,
            accuracyClass,
            balance.HasVerificationIntervalG ? balance.VerificationIntervalG : null);
        Throw(profile.Validate(field));
        return profile;
    }

    public static PipetteProfile? ToChemistry(Contract.PipetteProfile? pipette, string field)
    {
        if (pipette is null)
        {
            return null;
        }

        var profile = new PipetteProfile(pipette.Id, pipette.NominalVolumeUl, pipette.MinVolumeUl);
        Throw(profile.Validate(field));
        return profile;
    }

    private static void Throw(IReadOnlyList<InputError> errors)
    {
        if (errors.Count > 0)
        {
            throw new InvalidInputException(errors);
        }
    }
}
