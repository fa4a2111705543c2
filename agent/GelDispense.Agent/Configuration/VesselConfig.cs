using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Configuration;

/// <summary>
/// The vessel the station weighs into: its empty mass loads the balance, a re-plan may not overfill it, and with
/// <see cref="Cumulative"/> it stays on the balance untared from step to step (targets are running readings).
/// </summary>
public sealed record VesselConfig
{
    public double TareG { get; init; }

    public bool Cumulative { get; init; }

    public double? CapacityMl { get; init; }

    /// <summary>The plan options a batch in this vessel is started with.</summary>
    public PlanOptions ToPlanOptions()
    {
        var options = new PlanOptions { VesselTareG = TareG, Cumulative = Cumulative };
        if (CapacityMl is { } capacity)
        {
            options.VesselCapacityMl = capacity;
        }

        return options;
    }
}
