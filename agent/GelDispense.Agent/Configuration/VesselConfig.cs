using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Configuration;

/// <summary>The vessel the station weighs into: its empty mass loads the balance, and a re-plan may not overfill it.</summary>
public sealed record VesselConfig
{
    public double TareG { get; init; }

    public double? CapacityMl { get; init; }

    /// <summary>The plan options a batch in this vessel is started with.</summary>
    public PlanOptions ToPlanOptions()
    {
        var options = new PlanOptions { VesselTareG = TareG };
        if (CapacityMl is { } capacity)
        {
            options.VesselCapacityMl = capacity;
        }

        return options;
    }
}
