using FsCheck;
using FsCheck.Xunit;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Tolerances;

namespace GelDispense.Chemistry.Tests.Tolerances;

public class WorstCaseTests
{
    /// <summary>
    /// The extremes of a linear-fractional function over a box lie at corners (a standard result of
    /// fractional programming); Dinkelbach's iteration must land on the same value as trying all 2^n corners.
    /// </summary>
    [Property(MaxTest = 300)]
    public bool Dinkelbach_finds_the_same_extremes_as_enumerating_every_corner(int seed)
    {
        var random = new Random(seed);
        var n = 2 + random.Next(6);
        var a = Enumerable.Range(0, n).Select(_ => random.NextDouble() * (random.Next(3) == 0 ? 0 : 1)).ToArray();
        var b = Enumerable.Range(0, n).Select(_ => 0.01 + random.NextDouble()).ToArray();
        var m = Enumerable.Range(0, n).Select(_ => 0.1 + random.NextDouble() * 10).ToArray();
        var t = m.Select(x => x * random.NextDouble() * 0.2).ToArray();
        var q = new SpecQuantity("q", new SpecTarget(1, 1), a, b);

        var (min, max) = WorstCase.Range(q, m, t);
        var (bruteMin, bruteMax) = BruteForce(q, m, t);
        return Math.Abs(min - bruteMin) <= 1e-12 * Math.Abs(bruteMin) + 1e-15
            && Math.Abs(max - bruteMax) <= 1e-12 * Math.Abs(bruteMax) + 1e-15;
    }

    internal static (double Min, double Max) BruteForce(SpecQuantity q, double[] m, double[] t)
    {
        double min = double.MaxValue, max = double.MinValue;
        var x = new double[m.Length];
        for (var corner = 0; corner < 1 << m.Length; corner++)
        {
            for (var i = 0; i < m.Length; i++)
            {
                x[i] = Math.Max(0, m[i] + ((corner >> i & 1) == 1 ? t[i] : -t[i]));
            }

            var v = q.Evaluate(x);
            (min, max) = (Math.Min(min, v), Math.Max(max, v));
        }

        return (min, max);
    }
}
