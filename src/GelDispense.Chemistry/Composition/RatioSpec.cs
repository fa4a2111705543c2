namespace GelDispense.Chemistry.Composition;

/// <summary>A spec on the mole ratio of one component's active substance to total precursor.</summary>
public sealed record RatioSpec(string ReagentId, SpecTarget Target);
