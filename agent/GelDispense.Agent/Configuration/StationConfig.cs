namespace GelDispense.Agent.Configuration;

/// <summary>
/// The station config file (JSON, camelCase, comments allowed, unknown fields refused so a typo is never
/// silently ignored). Everything has a default except the balance connection.
/// </summary>
public sealed record StationConfig
{
    public string ServiceAddress { get; init; } = "http://127.0.0.1:5081";

    /// <summary>Other replicas of the service, tried in order when the one in use is down or shedding load.</summary>
    public IReadOnlyList<string> StandbyAddresses { get; init; } = [];

    public string StationId { get; init; } = "station-1";

    public string? ApiKey { get; init; }

    public ServiceTlsConfig? Service { get; init; }

    public BalanceConfig Balance { get; init; } = new();

    public StabilityConfig Stability { get; init; } = new();

    public PipetteConfig? Pipette { get; init; }

    public VesselConfig? Vessel { get; init; }
}
