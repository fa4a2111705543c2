using GelDispense.Agent.Links;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Service;

namespace GelDispense.Agent.Display;

/// <summary>
/// Everything the technician sees at one moment, as plain data: the step, its target and window (net grams from the
/// step's zero), the live reading, stability and drift, both links, and the reagent's cautions. Immutable, so the
/// display thread and a simulated technician can read it while the sequencer makes the next one.
/// </summary>
public sealed record StationView
{
    public required string BatchId { get; init; }

    public required string RecipeName { get; init; }

    /// <summary>Plan step index of the current step; -1 when no step is open.</summary>
    public int StepIndex { get; init; } = -1;

    public int StepNumber { get; init; }

    public int StepCount { get; init; }

    public string ReagentId { get; init; } = "";

    public string LotId { get; init; } = "";

    public StepPhase Phase { get; init; }

    public double? TargetNetG { get; init; }

    public double? LowNetG { get; init; }

    public double? HighNetG { get; init; }

    /// <summary>The gross reading the step counts from (≈0 after a tare).</summary>
    public double? BaselineG { get; init; }

    public double? LiveGrossG { get; init; }

    /// <summary>stable, moving, overload, underload, error or no reading.</summary>
    public string ReadingState { get; init; } = "no reading";

    /// <summary>The drift slope in g/min when the reading is drifting, else null.</summary>
    public double? DriftGPerMin { get; init; }

    /// <summary>Pipette steps: the volume to deliver at the recipe temperature, mL.</summary>
    public double? VolumeToDeliverMl { get; init; }

    /// <summary>Pipette steps: density used to turn the balance delta into a volume, g/mL.</summary>
    public double? DensityGPerMl { get; init; }

    public double TemperatureC { get; init; } = 20;

    public IReadOnlyList<string> Cautions { get; init; } = [];

    public LinkStatus BalanceStatus { get; init; } = LinkStatus.Connecting;

    public ServiceStatus ServiceStatus { get; init; }

    public int PendingAdditions { get; init; }

    /// <summary>What the technician should do now, in a few words.</summary>
    public string Hint { get; init; } = "";

    public double ReadabilityG { get; init; } = 0.0001;

    public double? LiveNetG => LiveGrossG - BaselineG;

    /// <summary>Pipette steps: the volume the live net reading stands for, mL.</summary>
    public double? LiveVolumeMl => VolumeToDeliverMl is { } v && TargetNetG is { } t && t > 0 ? LiveNetG * v / t : null;
}
