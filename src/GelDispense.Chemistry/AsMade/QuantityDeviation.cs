namespace GelDispense.Chemistry.AsMade;

/// <summary>One quantity as made against its nominal value, flagged against its tolerance.</summary>
public sealed record QuantityDeviation(
    string Quantity,
    double Nominal,
    double Actual,
    double TolerancePct)
{
    public double DeviationAbsolute => Actual - Nominal;

    public double DeviationPct => Nominal == 0 ? 0 : 100 * (Actual - Nominal) / Nominal;

    public bool WithinTolerance => Math.Abs(DeviationPct) <= TolerancePct * (1 + 1e-9);
}
