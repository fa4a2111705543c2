namespace GelDispense.Chemistry.AsMade;

/// <summary>A plan step as made: the reading, the true mass behind it, and how it sits in its window.</summary>
public sealed record StepOutcome(
    int StepIndex,
    string ReagentId,
    double PlannedMassG,
    double ReadingG,
    double TrueMassG,
    double ToleranceG)
{
    public double DeviationG => TrueMassG - PlannedMassG;

    public bool WithinWindow => Math.Abs(DeviationG) <= ToleranceG * (1 + 1e-9);
}
