namespace GelDispense.Chemistry.AsMade;

/// <summary>A net balance reading recorded for a plan step, as the balance showed it (conventional mass, g).</summary>
public readonly record struct RecordedReading(int StepIndex, double ReadingG);
