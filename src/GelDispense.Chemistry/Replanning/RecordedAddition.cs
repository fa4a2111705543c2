namespace GelDispense.Chemistry.Replanning;

/// <summary>What went into the vessel at a plan step, as a true (buoyancy-corrected) mass.</summary>
public readonly record struct RecordedAddition(int StepIndex, double TrueMassG);
