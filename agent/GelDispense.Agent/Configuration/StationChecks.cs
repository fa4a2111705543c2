using System.Text.RegularExpressions;
using GelDispense.Agent.Service;

namespace GelDispense.Agent.Configuration;

/// <summary>Checks the service, identity and pipette parts of a station config.</summary>
internal static partial class StationChecks
{
    public static void Check(StationConfig config, ErrorList errors)
    {
        var address = Uri.TryCreate(config.ServiceAddress, UriKind.Absolute, out var uri) ? uri : null;
        errors.Require(address?.Scheme is "http" or "https", "serviceAddress", config.ServiceAddress, "must be an absolute http:// or https:// address");
        CheckStandbys(config, address, errors);
        errors.Require(StationIdPattern().IsMatch(config.StationId), "stationId", config.StationId, "use 1 to 64 letters, digits, '.', '_' or '-'");
        if (config.Service is { } tls)
        {
            CheckTls(tls, address, errors);
        }

        if (config.Pipette is { } pipette)
        {
            errors.Require(pipette.NominalVolumeUl > 0, "pipette.nominalVolumeUl", pipette.NominalVolumeUl, "must be above 0 µL");
            errors.Require(pipette.MinVolumeUl > 0 && pipette.MinVolumeUl <= pipette.NominalVolumeUl, "pipette.minVolumeUl", pipette.MinVolumeUl, "must be above 0 and at most the nominal volume");
        }

        if (config.Vessel is { } vessel)
        {
            errors.Require(vessel.TareG >= 0 && double.IsFinite(vessel.TareG), "vessel.tareG", vessel.TareG, "must be 0 g or more");
            errors.Require(vessel.CapacityMl is null || (vessel.CapacityMl > 0 && double.IsFinite(vessel.CapacityMl.Value)), "vessel.capacityMl", vessel.CapacityMl, "must be above 0 mL");
        }
    }

    private static void CheckStandbys(StationConfig config, Uri? address, ErrorList errors)
    {
        var seen = new HashSet<Uri>();
        if (address is not null)
        {
            seen.Add(address);
        }

        for (var i = 0; i < config.StandbyAddresses.Count; i++)
        {
            var field = $"standbyAddresses[{i}]";
            var text = config.StandbyAddresses[i];
            if (!Uri.TryCreate(text, UriKind.Absolute, out var standby) || standby.Scheme is not ("http" or "https"))
            {
                errors.Add(field, text, "must be an absolute http:// or https:// address");
                continue;
            }

            // One TLS section serves every address, so a mix of plain and TLS replicas cannot be configured.
            errors.Require(address is null || standby.Scheme == address.Scheme, field, text, $"must use the same scheme as serviceAddress ({address?.Scheme})");
            errors.Require(seen.Add(standby), field, text, "is listed twice (or equals serviceAddress)");
        }
    }

    private static void CheckTls(ServiceTlsConfig tls, Uri? address, ErrorList errors)
    {
        var any = tls.CaCertificateFile is not null || tls.ClientCertificateFile is not null;
        errors.Require(!any || address?.Scheme == "https", "service", address?.ToString(), "certificates need an https:// serviceAddress");
        errors.Require(tls.ClientCertificatePassword is null || tls.ClientCertificateFile is not null,
            "service.clientCertificatePassword", "(set)", "is given without service.clientCertificateFile");
        if (tls.CaCertificateFile is { } ca && ServiceTls.Refusal(() => ServiceTls.LoadCa(ca)) is { } caRefusal)
        {
            errors.Add("service.caCertificateFile", ca, caRefusal);
        }

        if (tls.ClientCertificateFile is { } client
            && ServiceTls.Refusal(() => ServiceTls.LoadClient(client, tls.ClientCertificatePassword)) is { } clientRefusal)
        {
            errors.Add("service.clientCertificateFile", client, clientRefusal);
        }
    }

    [GeneratedRegex("^[A-Za-z0-9._-]{1,64}$")]
    private static partial Regex StationIdPattern();
}
