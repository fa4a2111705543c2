using GelDispense.Agent.Stability;

namespace GelDispense.Agent.Configuration;

/// <summary>Checks the stability section and converts seconds to time spans.</summary>
internal static class StabilityChecks
{
    public static StabilitySettings Resolve(StabilityConfig c, ErrorList errors)
    {
        StabilityMode? mode = c.Mode.ToLowerInvariant() switch
        {
            "auto" => StabilityMode.Auto,
            "flag" => StabilityMode.BalanceFlag,
            "software" => StabilityMode.Software,
            _ => null,
        };
        errors.Require(mode is not null, "stability.mode", c.Mode, "use auto, flag or software");
        errors.Require(c.MinReadings is >= 2 and <= 1000, "stability.minReadings", c.MinReadings, "must be 2 to 1000 readings");
        errors.Require(c.BandG > 0, "stability.bandG", c.BandG, "must be above 0 g");
        errors.Require(c.WindowS is > 0 and <= 600, "stability.windowS", c.WindowS, "must be above 0 and at most 600 s");
        errors.Require(c.DriftWindowS > c.WindowS && c.DriftWindowS <= 3600, "stability.driftWindowS", c.DriftWindowS, "must be longer than stability.windowS and at most 3600 s");
        errors.Require(c.DriftThresholdGPerMin > 0, "stability.driftThresholdGPerMin", c.DriftThresholdGPerMin, "must be above 0 g/min");
        var valid = mode is not null && c.WindowS is > 0 and <= 600 && c.DriftWindowS is > 0 and <= 3600;
        return !valid ? new StabilitySettings() : new StabilitySettings
        {
            Mode = mode!.Value,
            MinReadings = c.MinReadings,
            BandG = c.BandG,
            Window = TimeSpan.FromSeconds(c.WindowS),
            DriftWindow = TimeSpan.FromSeconds(c.DriftWindowS),
            DriftThresholdGPerMin = c.DriftThresholdGPerMin,
        };
    }
}
