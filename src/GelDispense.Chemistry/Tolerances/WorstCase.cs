namespace GelDispense.Chemistry.Tolerances;

/// <summary>
/// The exact extreme of a ratio of linear forms over a box of step errors |δ_i| ≤ t_i. A linear-fractional
/// function takes its extremes at corners of the box, and for a trial value q the best corner is found
/// coordinate by coordinate from the sign of a_i − q·b_i. Dinkelbach's iteration (Management Science 13
/// (1967) 492) moves q to the value at that corner until it stops rising; it ends on the worst corner
/// itself, so the bound is an exact evaluation, not a first-order estimate.
/// </summary>
public static class WorstCase
{
    private const int MaxIterations = 64;

    /// <summary>Largest and smallest Q over the box, each evaluated exactly at its corner.</summary>
    public static (double Min, double Max) Range(SpecQuantity q, ReadOnlySpan<double> massesG, ReadOnlySpan<double> windowsG) =>
        (Extreme(q, massesG, windowsG, -1), Extreme(q, massesG, windowsG, +1));

    /// <summary>The largest |Q − target| over the box.</summary>
    public static double Deviation(SpecQuantity q, ReadOnlySpan<double> massesG, ReadOnlySpan<double> windowsG)
    {
        var (min, max) = Range(q, massesG, windowsG);
        return Math.Max(Math.Abs(max - q.Target.Value), Math.Abs(min - q.Target.Value));
    }

    private static double Extreme(SpecQuantity q, ReadOnlySpan<double> m, ReadOnlySpan<double> t, int direction)
    {
        var a = q.NumeratorPerG;
        var b = q.DenominatorPerG;
        var value = q.Evaluate(m);
        for (var iteration = 0; iteration < MaxIterations; iteration++)
        {
            double num = 0, den = 0;
            for (var i = 0; i < m.Length; i++)
            {
                var slope = a[i] - value * b[i];
                var x = m[i] + (slope * direction >= 0 ? t[i] : -t[i]);
                if (x < 0)
                {
                    x = 0;
                }

                num += a[i] * x;
                den += b[i] * x;
            }

            var next = num / den;
            if ((next - value) * direction <= Math.Abs(value) * 1e-15)
            {
                return direction > 0 ? Math.Max(value, next) : Math.Min(value, next);
            }

            value = next;
        }

        return value;
    }
}
