using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Reagents;
using GelDispense.Chemistry.Tolerances;

namespace GelDispense.Chemistry.Replanning;

/// <summary>
/// The re-plan as a linear least-squares problem. Unknowns: one extra mass y_j ≥ 0 per line that may still
/// receive reagent (final mass = already added + y_j) and the batch factor k (last column).
/// </summary>
internal sealed class ReplanProblem
{
    /// <summary>One tolerance of a spec quantity weighs as much as a thousand step limits of solvent or water proportion.</summary>
    private const double SpecWeight = 1e3;

    /// <summary>
    /// Precursors, catalysts and additives keep their ratios as firmly as the spec itself: the re-plan moves the
    /// solvent and the water, which is what a formulator would adjust, not the catalyst.
    /// </summary>
    private static double ProportionWeight(ReagentRole role) => role is ReagentRole.Solvent or ReagentRole.Water ? 1 : SpecWeight;

    private readonly double[] _lower;
    private readonly int[] _variableLine;
    private readonly double[][] _rows;
    private readonly List<double> _targets;
    private readonly double[] _volumePerG;

    private ReplanProblem(double[] lower, int[] variableLine, double[][] rows, List<double> targets, double[] volumePerG)
    {
        _lower = lower;
        _variableLine = variableLine;
        _rows = rows;
        _targets = targets;
        _volumePerG = volumePerG;
    }

    public double[,] Matrix => To2D(_rows, _variableLine.Length + 1);

    public double[] Target => [.. _targets];

    public bool[] Bounded => [.. _variableLine.Select(_ => true), false];

    public static ReplanProblem Build(Formulation f, double[] planned, Dictionary<int, double> done, IReadOnlyList<SpecQuantity> quantities, PlanOptions options, bool allowTopUps)
    {
        var n = planned.Length;
        var lower = new double[n];
        foreach (var (line, mass) in done)
        {
            lower[line] = mass;
        }

        var variableLine = Enumerable.Range(0, n).Where(j => planned[j] > 0 && (!done.ContainsKey(j) || allowTopUps)).ToArray();
        var k0 = Math.Max(1, done.Where(d => planned[d.Key] > 0).Select(d => d.Value / planned[d.Key]).DefaultIfEmpty(1).Max());
        var rows = new List<double[]>();
        var targets = new List<double>();
        var p = variableLine.Length + 1;
        foreach (var q in quantities)
        {
            var reference = 0.0;
            for (var j = 0; j < n; j++)
            {
                reference += q.DenominatorPerG[j] * planned[j] * k0;
            }

            var scale = SpecWeight / (q.Target.ToleranceAbsolute * reference);
            var row = new double[p];
            var rhs = 0.0;
            for (var j = 0; j < n; j++)
            {
                var c = (q.NumeratorPerG[j] - q.Target.Value * q.DenominatorPerG[j]) * scale;
                rhs -= c * lower[j];
                var v = Array.IndexOf(variableLine, j);
                if (v >= 0)
                {
                    row[v] = c;
                }
            }

            rows.Add(row);
            targets.Add(rhs);
        }

        for (var j = 0; j < n; j++)
        {
            if (planned[j] <= 0)
            {
                continue;
            }

            var unit = options.StepLimitPct(f.Lines[j].ReagentId) / 100 * planned[j] * k0 / ProportionWeight(f.Lines[j].Reagent.Definition.Role);
            var row = new double[p];
            var v = Array.IndexOf(variableLine, j);
            if (v >= 0)
            {
                row[v] = 1 / unit;
            }

            row[p - 1] = -planned[j] / unit;
            rows.Add(row);
            targets.Add(-lower[j] / unit);
        }

        // Among batch sizes that fit equally well, prefer the smallest that absorbs what is already in the vessel.
        var pull = new double[p];
        pull[p - 1] = 1;
        rows.Add(pull);
        targets.Add(k0);

        return new ReplanProblem(lower, variableLine, [.. rows], targets, [.. f.Lines.Select(l => l.VolumeMlPerG)]);
    }

    /// <summary>The vessel capacity as an exact condition on the unknowns: the final volume equals the capacity.</summary>
    public (double[] C, double D) CapacityEquality(double capacityMl)
    {
        var c = new double[_variableLine.Length + 1];
        var fixedVolume = 0.0;
        for (var j = 0; j < _lower.Length; j++)
        {
            fixedVolume += _lower[j] * _volumePerG[j];
        }

        for (var v = 0; v < _variableLine.Length; v++)
        {
            c[v] = _volumePerG[_variableLine[v]];
        }

        return (c, capacityMl - fixedVolume);
    }

    public double[] Masses(double[] z)
    {
        var masses = (double[])_lower.Clone();
        for (var v = 0; v < _variableLine.Length; v++)
        {
            masses[_variableLine[v]] += Math.Max(0, z[v]);
        }

        return masses;
    }

    public double Scale(double[] z) => z[^1];

    private static double[,] To2D(double[][] rows, int p)
    {
        var a = new double[rows.Length, p];
        for (var r = 0; r < rows.Length; r++)
        {
            for (var c = 0; c < p; c++)
            {
                a[r, c] = rows[r][c];
            }
        }

        return a;
    }
}
