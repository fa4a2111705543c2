using System.Text.RegularExpressions;

namespace GelDispense.Agent.Configuration;

/// <summary>Checks the service, identity and pipette parts of a station config.</summary>
internal static partial class StationChecks
{
    public static void Check(StationConfig config, ErrorList errors)
    {
        var address = Uri.TryCreate(config.ServiceAddress, UriKind.Absolute, out var uri) ? uri : null;
        errors.Require(address?.Scheme is "http" or "https", "serviceAddress", config.ServiceAddress, "must be an absolute http:// or https:// address");
        errors.Require(StationIdPattern().IsMatch(config.StationId), "stationId", config.StationId, "use 1 to 64 letters, digits, '.', '_' or '-'");
        if (config.Pipette is { } pipette)
        {
            errors.Require(pipette.NominalVolumeUl > 0, "pipette.nominalVolumeUl", pipette.NominalVolumeUl, "must be above 0 µL");
            errors.Require(pipette.MinVolumeUl > 0 && pipette.MinVolumeUl <= pipette.NominalVolumeUl, "pipette.minVolumeUl", pipette.MinVolumeUl, "must be above 0 and at most the nominal volume");
        }
    }

    [GeneratedRegex("^[A-Za-z0-9._-]{1,64}$")]
    private static partial Regex StationIdPattern();
}
