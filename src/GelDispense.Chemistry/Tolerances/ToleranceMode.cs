namespace GelDispense.Chemistry.Tolerances;

/// <summary>How step errors combine against a spec tolerance.</summary>
public enum ToleranceMode
{
    /// <summary>Every combination of errors inside the windows keeps the spec (checked exactly at the worst corner).</summary>
    WorstCase,

    /// <summary>Root-sum-square of first-order contributions: wider windows, a statistical rather than a hard guarantee.</summary>
    RootSumSquare,
}
