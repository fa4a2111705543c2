namespace GelDispense.Chemistry.Replanning;

/// <summary>A corrective extra addition of a reagent already added (only when top-ups are allowed).</summary>
public sealed record TopUp(int StepIndex, string ReagentId, double ExtraMassG);
