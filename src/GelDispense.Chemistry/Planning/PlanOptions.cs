using GelDispense.Chemistry.Tolerances;

namespace GelDispense.Chemistry.Planning;

/// <summary>Choices that shape a plan; the defaults suit a technician weighing into one vessel.</summary>
public sealed record PlanOptions
{
    public ToleranceMode Mode { get; init; } = ToleranceMode.WorstCase;

    /// <summary>True: the vessel stays on the balance without re-taring, so targets are cumulative readings.</summary>
    public bool Cumulative { get; init; }

    /// <summary>Cap on each step's window in % of its mass; binds the ratios the spec does not name.</summary>
    public double DefaultStepLimitPct { get; init; } = 2.0;

    /// <summary>Per-reagent overrides of <see cref="DefaultStepLimitPct"/>.</summary>
    public IReadOnlyDictionary<string, double> StepLimitPctByReagent { get; init; } = new Dictionary<string, double>();

    /// <summary>Reagents to deliver by volume (pipette or dispenser) whenever the pipette can.</summary>
    public IReadOnlyList<string> VolumetricReagentIds { get; init; } = [];

    /// <summary>Mass of the empty vessel on the balance, which counts toward the balance's load.</summary>
    public double VesselTareG { get; init; }

    /// <summary>Working volume of the vessel; the re-plan may not go beyond it.</summary>
    public double? VesselCapacityMl { get; init; }

    public double StepLimitPct(string reagentId) =>
        StepLimitPctByReagent.TryGetValue(reagentId, out var pct) ? pct : DefaultStepLimitPct;
}
