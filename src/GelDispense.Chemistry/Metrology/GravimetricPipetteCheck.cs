using GelDispense.Chemistry.Errors;

namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// Gravimetric pipette check after ISO 8655-6: each delivery of water is weighed, converted to volume
/// with the Z factor (V = m·Z), and the mean and spread are compared with the maximum permissible
/// errors. ISO 8655-6 asks for 10 weighings per volume (from memory); fewer (at least 2) are accepted
/// for a quick station check, and the result reports n. No evaporation correction is applied.
/// </summary>
public static class GravimetricPipetteCheck
{
    /// <summary>Evaluates a series of weighings; bad input throws <see cref="InvalidInputException"/> naming every bad field.</summary>
    /// <param name="pipette">The pipette and its limits.</param>
    /// <param name="selectedVolumeUl">Volume set on the pipette, µL, inside its useful range.</param>
    /// <param name="massesMg">Mass of water of each delivery, mg (balance readings: Z corrects for buoyancy).</param>
    /// <param name="temperatureC">Water and air temperature, °C.</param>
    /// <param name="pressureHpa">Barometric pressure, hPa.</param>
    /// <param name="relativeHumidityPct">Relative humidity, %.</param>
    public static PipetteCheckResult Evaluate(
        PipetteProfile pipette,
        double selectedVolumeUl,
        IReadOnlyList<double> massesMg,
        double temperatureC,
        double pressureHpa,
        double relativeHumidityPct = 50)
    {
        ArgumentNullException.ThrowIfNull(pipette);
        ArgumentNullException.ThrowIfNull(massesMg);
        var errors = Validate(pipette, selectedVolumeUl, massesMg, temperatureC, pressureHpa, relativeHumidityPct);
        if (errors.Count > 0)
        {
            throw new InvalidInputException(errors);
        }

        var z = ZFactor.MicrolitresPerMilligram(temperatureC, pressureHpa, relativeHumidityPct);
        var volumesUl = massesMg.Select(m => m * z).ToArray();
        var meanUl = volumesUl.Average();
        var sumOfSquaresUl2 = volumesUl.Sum(v => (v - meanUl) * (v - meanUl));
        var standardDeviationUl = Math.Sqrt(sumOfSquaresUl2 / (volumesUl.Length - 1));
        var systematicUl = meanUl - selectedVolumeUl;
        var (systematicMpeUl, randomMpeUl) = PipetteCapability.MaximumPermissibleErrorsUl(pipette);

        return new PipetteCheckResult(
            pipette.Id,
            selectedVolumeUl,
            volumesUl.Length,
            z,
            meanUl,
            systematicUl,
            100 * systematicUl / selectedVolumeUl,
            standardDeviationUl,
            100 * standardDeviationUl / meanUl,
            systematicMpeUl,
            randomMpeUl);
    }

    private static List<InputError> Validate(
        PipetteProfile pipette,
        double selectedVolumeUl,
        IReadOnlyList<double> massesMg,
        double temperatureC,
        double pressureHpa,
        double relativeHumidityPct)
    {
        var errors = pipette.Validate().ToList();
        if (errors.Count == 0 && !PipetteCapability.CanDeliver(pipette, selectedVolumeUl, out var reason))
        {
            errors.Add(new InputError("selectedVolumeUl", InputChecks.Format(selectedVolumeUl), reason));
        }

        if (massesMg.Count < 2)
        {
            errors.Add(new InputError("massesMg", $"{massesMg.Count} weighings", "needs at least 2 weighings for a standard deviation"));
        }

        for (var i = 0; i < massesMg.Count; i++)
        {
            InputChecks.Positive(errors, $"massesMg[{i}]", massesMg[i]);
        }

        InputChecks.InRange(errors, "temperatureC", temperatureC, WaterDensity.MinTemperatureC, WaterDensity.MaxTemperatureC);
        InputChecks.InRange(errors, "pressureHpa", pressureHpa, AirDensity.MinPressureHpa, AirDensity.MaxPressureHpa);
        InputChecks.InRange(errors, "relativeHumidityPct", relativeHumidityPct, 0, 100);
        return errors;
    }
}
