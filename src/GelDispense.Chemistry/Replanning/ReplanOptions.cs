namespace GelDispense.Chemistry.Replanning;

/// <summary>What a re-plan may do besides retargeting the steps not yet made.</summary>
public sealed record ReplanOptions
{
    /// <summary>Allow adding more of a reagent already added (a corrective top-up), which can restore R after a water over-pour.</summary>
    public bool AllowTopUps { get; init; }
}
