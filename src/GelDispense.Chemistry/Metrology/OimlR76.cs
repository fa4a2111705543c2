namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// Limits of OIML R 76-1 (non-automatic weighing instruments): maximum permissible errors from
/// Table 6 and the minimum capacity from Table 3.
/// </summary>
public static class OimlR76
{
    /// <summary>
    /// Relative slack on the band edges: a load stated in grams at an edge (5 g on e = 1 mg is
    /// 5000 e) must fall in the lower band although load/e is computed in binary floating point.
    /// </summary>
    internal const double EdgeSlack = 1e-9;

    /// <summary>
    /// Maximum permissible error, g. R 76-1 Table 6 at initial verification: ±0.5 e, ±1.0 e and
    /// ±1.5 e in three load bands per class (in e: I 50 000 / 200 000 / above; II 5 000 / 20 000 /
    /// 100 000; III 500 / 2 000 / 10 000; IIII 50 / 200 / 1 000); in service the mpe is twice that.
    /// </summary>
    /// <param name="accuracyClass">Accuracy class of the instrument.</param>
    /// <param name="verificationIntervalG">Verification scale interval e, g.</param>
    /// <param name="loadG">Load on the receptor, g (the table's m).</param>
    /// <param name="inService">True for the in-service mpe (twice the initial one).</param>
    /// <exception cref="ArgumentOutOfRangeException">
    /// The load exceeds the last band of the class (<see cref="MaximumLoadIntervals"/>): the table
    /// gives no mpe there because no instrument of that class reaches it.
    /// </exception>
    public static double MaximumPermissibleErrorG(
        AccuracyClass accuracyClass, double verificationIntervalG, double loadG, bool inService = false)
    {
        ArgumentGuard.Positive(verificationIntervalG, nameof(verificationIntervalG));
        ArgumentGuard.InRange(loadG, 0, double.MaxValue, nameof(loadG));
        var (halfE, oneE, oneAndHalfE) = BandEdges(accuracyClass);
        var loadIntervals = loadG / verificationIntervalG / (1 + EdgeSlack);

        var mpeIntervals = loadIntervals switch
        {
            _ when loadIntervals <= halfE => 0.5,
            _ when loadIntervals <= oneE => 1.0,
            _ when loadIntervals <= oneAndHalfE => 1.5,
            _ => throw new ArgumentOutOfRangeException(
                nameof(loadG), loadG, $"is beyond {oneAndHalfE} e, the last mpe band of class {accuracyClass}"),
        };
        return mpeIntervals * verificationIntervalG * (inService ? 2 : 1);
    }

    /// <summary>
    /// Minimum capacity Min, g, from R 76-1 Table 3: 100 e (class I); 20 e for e ≤ 0.05 g and 50 e
    /// for e ≥ 0.1 g (class II); 20 e (class III); 10 e (class IIII, from memory). e values are
    /// 1, 2 or 5 × 10^k, so no legal e lies between 0.05 g and 0.1 g.
    /// </summary>
    /// <param name="c">Accuracy class.</param>
    /// <param name="verificationIntervalG">Verification scale interval e, g.</param>
    public static double MinimumCapacityG(AccuracyClass c, double verificationIntervalG)
    {
        ArgumentGuard.Positive(verificationIntervalG, nameof(verificationIntervalG));
        var intervals = c switch
        {
            AccuracyClass.I => 100,
            AccuracyClass.II => verificationIntervalG <= 0.05 * (1 + EdgeSlack) ? 20 : 50,
            AccuracyClass.III => 20,
            AccuracyClass.IIII => 10,
            _ => throw new ArgumentOutOfRangeException(nameof(c), c, "unknown accuracy class"),
        };
        return intervals * verificationIntervalG;
    }

    /// <summary>
    /// Largest load, in multiples of e, for which Table 6 gives an mpe: the top of the ±1.5 e band
    /// (unbounded for class I).
    /// </summary>
    public static double MaximumLoadIntervals(AccuracyClass accuracyClass) => BandEdges(accuracyClass).OneAndHalfE;

    private static (double HalfE, double OneE, double OneAndHalfE) BandEdges(AccuracyClass accuracyClass) => accuracyClass switch
    {
        AccuracyClass.I => (50_000, 200_000, double.PositiveInfinity),
        AccuracyClass.II => (5_000, 20_000, 100_000),
        AccuracyClass.III => (500, 2_000, 10_000),
        AccuracyClass.IIII => (50, 200, 1_000),
        _ => throw new ArgumentOutOfRangeException(nameof(accuracyClass), accuracyClass, "unknown accuracy class"),
    };
}
