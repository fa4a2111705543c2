namespace GelDispense.Chemistry.Tolerances;

/// <summary>
/// Hands out per-step ± windows (g, on the true mass) so that the spec holds for every combination of
/// errors inside them. Windows grow together in proportion to each step's device error — the weakest
/// device gets the widest window — until a spec quantity's budget is used up; the steps that quantity
/// depends on then stop, and the rest keep growing until they reach their cap (a relative limit per
/// step that stands in for the ratios the spec does not name). The result is max–min fair in
/// window/device-error, so no step is tighter than the budget forces.
/// </summary>
public static class ToleranceAllocator
{
    private const int BisectionSteps = 52;

    public static double[] Allocate(
        IReadOnlyList<SpecQuantity> quantities,
        ReadOnlySpan<double> massesG,
        ReadOnlySpan<double> deviceErrorG,
        ReadOnlySpan<double> capG,
        ToleranceMode mode)
    {
        var n = massesG.Length;
        var windows = new double[n];
        var frozen = new bool[n];
        var weights = new double[n];
        for (var i = 0; i < n; i++)
        {
            weights[i] = Math.Max(deviceErrorG[i], 1e-12);
            frozen[i] = capG[i] <= 0;
        }

        var masses = massesG.ToArray();
        var caps = capG.ToArray();
        var level = 0.0;
        for (var round = 0; round <= n; round++)
        {
            var top = 0.0;
            for (var i = 0; i < n; i++)
            {
                top = frozen[i] ? top : Math.Max(top, caps[i] / weights[i]);
            }

            if (top <= level || Holds(quantities, masses, Fill(windows, frozen, weights, caps, top), mode))
            {
                Fill(windows, frozen, weights, caps, Math.Max(top, level));
                break;
            }

            var (lo, hi) = (level, top);
            for (var k = 0; k < BisectionSteps; k++)
            {
                var mid = 0.5 * (lo + hi);
                (lo, hi) = Holds(quantities, masses, Fill(windows, frozen, weights, caps, mid), mode) ? (mid, hi) : (lo, mid);
            }

            level = lo;
            var grown = Fill(windows, frozen, weights, caps, hi).ToArray();
            var bound = new bool[n];
            var slopes = new double[n];
            foreach (var q in quantities.Where(q => !Holds([q], masses, grown, mode)))
            {
                q.Sensitivities(masses, slopes);
                for (var i = 0; i < n; i++)
                {
                    bound[i] |= slopes[i] != 0;
                }
            }

            Fill(windows, frozen, weights, caps, level);
            var froze = false;
            for (var i = 0; i < n; i++)
            {
                if (!frozen[i] && (windows[i] >= caps[i] || bound[i]))
                {
                    frozen[i] = froze = true;
                }
            }

            if (!froze)
            {
                break;
            }
        }

        return windows;
    }

    /// <summary>Whether every quantity stays inside its tolerance for all errors inside the windows.</summary>
    public static bool Holds(IReadOnlyList<SpecQuantity> quantities, ReadOnlySpan<double> massesG, ReadOnlySpan<double> windowsG, ToleranceMode mode)
    {
        // An index loop: Holds runs some fifty times per allocation, and a foreach over the interface would box an enumerator each time.
        for (var k = 0; k < quantities.Count; k++)
        {
            var q = quantities[k];
            var deviation = mode == ToleranceMode.WorstCase
                ? WorstCase.Deviation(q, massesG, windowsG)
                : RssDeviation(q, massesG, windowsG);
            if (deviation > q.Target.ToleranceAbsolute)
            {
                return false;
            }
        }

        return true;
    }

    /// <summary>|Q(m) − target| plus the root-sum-square of first-order contributions.</summary>
    public static double RssDeviation(SpecQuantity q, ReadOnlySpan<double> massesG, ReadOnlySpan<double> windowsG)
    {
        Span<double> slopes = massesG.Length <= 64 ? stackalloc double[massesG.Length] : new double[massesG.Length];
        q.Sensitivities(massesG, slopes);
        var sum = 0.0;
        for (var i = 0; i < massesG.Length; i++)
        {
            var c = slopes[i] * windowsG[i];
            sum += c * c;
        }

        return Math.Abs(q.Evaluate(massesG) - q.Target.Value) + Math.Sqrt(sum);
    }

    private static double[] Fill(double[] windows, bool[] frozen, double[] weights, double[] caps, double level)
    {
        for (var i = 0; i < windows.Length; i++)
        {
            if (!frozen[i])
            {
                windows[i] = Math.Min(caps[i], level * weights[i]);
            }
        }

        return windows;
    }
}
