using System.Globalization;

namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// What a balance can hold when a net addition is weighed by difference (tare, then add). The error
/// model, with the source of each part:
/// <list type="bullet">
/// <item>Repeatability known: the k = 2 expanded uncertainty of the difference of two independent
/// readings, 2·√2·s′ with s′ = max(s, 0.41 d). The 0.41 d floor is USP &lt;41&gt;'s; k = 2 and the
/// √2 for a difference follow the GUM (common practice).</item>
/// <item>Repeatability unknown, class and e known: the OIML R 76-1 Table 6 initial-verification mpe
/// at the gross load. R 76 applies the net-load mpe after tare (from memory); the bands only grow
/// with load, so the gross-load mpe is the larger, conservative choice. It is never taken below the
/// readability-only bound, because rounding of the two readings is always there.</item>
/// <item>Otherwise: the readability-only bound 2·√2·0.41 d ≈ 1.16 d, so that a balance with an unknown
/// s never looks better than one with a measured s below the floor.</item>
/// </list>
/// Sensitivity (span) error is not included: it scales with the load and is bounded separately by the
/// USP &lt;41&gt; accuracy test (within 0.10 % of the test weight); a caller holding a tolerance tighter
/// than about 0.1 % of the net mass should add it.
/// </summary>
public static class BalanceCapability
{
    /// <summary>USP &lt;41&gt;: s below 0.41 d is replaced by 0.41 d.</summary>
    public const double RepeatabilityFloorPerReadability = 0.41;

    /// <summary>USP &lt;41&gt;: 2·s/m ≤ 0.10 %, so m_min = 2000·s.</summary>
    public const double UspMinimumWeightPerRepeatability = 2000;

    private const double CoverageFactor = 2;

    /// <summary>The repeatability USP &lt;41&gt; calculates with, max(s, 0.41 d), g; 0.41 d when s is unknown.</summary>
    public static double EffectiveRepeatabilityG(BalanceProfile p)
    {
        ArgumentNullException.ThrowIfNull(p);
        ArgumentGuard.Positive(p.ReadabilityG, nameof(p));
        return Math.Max(p.RepeatabilityG ?? 0, RepeatabilityFloorPerReadability * p.ReadabilityG);
    }

    /// <summary>USP &lt;41&gt; minimum weight, 2000·max(s, 0.41 d), g (s = 0.15 mg gives 0.300 g).</summary>
    public static double UspMinimumWeightG(BalanceProfile p) =>
        UspMinimumWeightPerRepeatability * EffectiveRepeatabilityG(p);

    /// <summary>Error bound of one net addition weighed by difference, g (model in the class summary).</summary>
    /// <param name="p">The balance.</param>
    /// <param name="netMassG">The addition, g, greater than zero.</param>
    /// <param name="grossLoadG">Everything on the pan after the addition (vessel included), g, from the net mass up to the capacity.</param>
    public static double ExpectedErrorG(BalanceProfile p, double netMassG, double grossLoadG)
    {
        GuardLoads(p, netMassG, grossLoadG);
        ArgumentGuard.InRange(grossLoadG, netMassG, p.CapacityG, nameof(grossLoadG));
        var differenceG = CoverageFactor * Math.Sqrt(2) * EffectiveRepeatabilityG(p);
        if (p.RepeatabilityG is null && p.AccuracyClass is { } c && p.VerificationIntervalG is { } e)
        {
            return Math.Max(OimlR76.MaximumPermissibleErrorG(c, e, grossLoadG), differenceG);
        }

        return differenceG;
    }

    /// <summary>
    /// Whether the balance may weigh this addition at all: the gross load within capacity, the net
    /// mass at or above the laboratory's minimum weight and at or above the USP &lt;41&gt; minimum weight.
    /// </summary>
    /// <param name="p">The balance.</param>
    /// <param name="netMassG">The addition, g.</param>
    /// <param name="grossLoadG">Everything on the pan after the addition, g.</param>
    /// <param name="reason">Why not, in plain words; empty when the answer is true.</param>
    public static bool CanWeigh(BalanceProfile p, double netMassG, double grossLoadG, out string reason)
    {
        GuardLoads(p, netMassG, grossLoadG);
        var uspMinimumG = UspMinimumWeightG(p);
        reason = grossLoadG > p.CapacityG
            ? $"gross load {Grams(grossLoadG)} exceeds the capacity {Grams(p.CapacityG)}"
            : p.MinimumWeightG is { } userMinimumG && netMassG < userMinimumG
                ? $"net mass {Grams(netMassG)} is below the minimum weight {Grams(userMinimumG)} set for this balance"
                : netMassG < uspMinimumG
                    ? $"net mass {Grams(netMassG)} is below the USP <41> minimum weight {Grams(uspMinimumG)} (2000 × max(s, 0.41 d))"
                    : string.Empty;
        return reason.Length == 0;
    }

    private static void GuardLoads(BalanceProfile p, double netMassG, double grossLoadG)
    {
        ArgumentNullException.ThrowIfNull(p);
        ArgumentGuard.Positive(netMassG, nameof(netMassG));
        ArgumentGuard.InRange(grossLoadG, netMassG, double.MaxValue, nameof(grossLoadG));
    }

    private static string Grams(double massG) => massG.ToString("G6", CultureInfo.InvariantCulture) + " g";
}
