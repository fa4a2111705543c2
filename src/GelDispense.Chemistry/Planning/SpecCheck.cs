namespace GelDispense.Chemistry.Planning;

/// <summary>
/// A spec quantity in a plan: its target and tolerance, its nominal value, and the extremes reached when
/// every step sits at the worst corner of its window (exact evaluation).
/// </summary>
public sealed record SpecCheck(
    string Quantity,
    double Target,
    double TolerancePct,
    double Nominal,
    double WorstLow,
    double WorstHigh,
    bool Guaranteed);
