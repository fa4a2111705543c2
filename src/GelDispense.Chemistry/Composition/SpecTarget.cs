namespace GelDispense.Chemistry.Composition;

/// <summary>A nominal value with a symmetric tolerance in percent of that value.</summary>
public sealed record SpecTarget(double Value, double TolerancePct)
{
    public double ToleranceAbsolute => Math.Abs(Value) * TolerancePct / 100.0;

    public bool Accepts(double actual) => Math.Abs(actual - Value) <= ToleranceAbsolute * (1 + 1e-12);
}
