namespace GelDispense.Chemistry.Replanning;

/// <summary>
/// Minimises ‖A z − b‖² subject to z_j ≥ 0 for the bounded variables, by an active-set loop over the
/// normal equations: solve on the free set, pin the most negative variable at zero, repeat; then release
/// any pinned variable whose gradient says it wants to grow. An optional linear equality c·z = d is held
/// exactly through a Lagrange multiplier (the KKT system). Sized for re-plans (a few dozen unknowns).
/// No maintained .NET library offers bounded least squares with an equality (MathNet.Numerics has
/// unconstrained solvers only), hence this small routine.
/// </summary>
internal static class BoundedLeastSquares
{
    public static double[] Solve(double[,] a, double[] b, bool[] bounded, (double[] C, double D)? equality = null)
    {
        var p = a.GetLength(1);
        var pinned = new bool[p];
        var z = new double[p];
        for (var iteration = 0; iteration < 4 * p + 8; iteration++)
        {
            z = SolveFree(a, b, pinned, equality);
            var worst = -1;
            for (var j = 0; j < p; j++)
            {
                if (bounded[j] && !pinned[j] && z[j] < -1e-12 && (worst < 0 || z[j] < z[worst]))
                {
                    worst = j;
                }
            }

            if (worst >= 0)
            {
                pinned[worst] = true;
                continue;
            }

            var release = equality is null ? WantsToGrow(a, b, z, pinned) : -1;
            if (release < 0)
            {
                break;
            }

            pinned[release] = false;
        }

        for (var j = 0; j < p; j++)
        {
            z[j] = bounded[j] ? Math.Max(0, z[j]) : z[j];
        }

        return z;
    }

    private static int WantsToGrow(double[,] a, double[] b, double[] z, bool[] pinned)
    {
        var rows = a.GetLength(0);
        var best = -1;
        var bestGradient = -1e-10;
        for (var j = 0; j < z.Length; j++)
        {
            if (!pinned[j])
            {
                continue;
            }

            // Gradient of ½‖Az − b‖² along z_j; negative means increasing z_j lowers the residual.
            var g = 0.0;
            for (var r = 0; r < rows; r++)
            {
                var residual = -b[r];
                for (var k = 0; k < z.Length; k++)
                {
                    residual += a[r, k] * z[k];
                }

                g += a[r, j] * residual;
            }

            if (g < bestGradient)
            {
                (best, bestGradient) = (j, g);
            }
        }

        return best;
    }

    private static double[] SolveFree(double[,] a, double[] b, bool[] pinned, (double[] C, double D)? equality)
    {
        var rows = a.GetLength(0);
        var p = a.GetLength(1);
        var free = Enumerable.Range(0, p).Where(j => !pinned[j]).ToArray();
        var m = free.Length;
        var size = m + (equality is null ? 0 : 1);
        var n = new double[size, size + 1];
        for (var x = 0; x < m; x++)
        {
            for (var y = 0; y < m; y++)
            {
                var s = 0.0;
                for (var r = 0; r < rows; r++)
                {
                    s += a[r, free[x]] * a[r, free[y]];
                }

                n[x, y] = s + (x == y ? 1e-12 : 0);
            }

            var t = 0.0;
            for (var r = 0; r < rows; r++)
            {
                t += a[r, free[x]] * b[r];
            }

            n[x, size] = t;
        }

        if (equality is { } eq)
        {
            for (var x = 0; x < m; x++)
            {
                n[x, m] = eq.C[free[x]];
                n[m, x] = eq.C[free[x]];
            }

            n[m, size] = eq.D;
        }

        var solution = GaussianElimination(n, size);
        var z = new double[p];
        for (var x = 0; x < m; x++)
        {
            z[free[x]] = solution[x];
        }

        return z;
    }

    private static double[] GaussianElimination(double[,] n, int m)
    {
        for (var col = 0; col < m; col++)
        {
            var pivot = col;
            for (var r = col + 1; r < m; r++)
            {
                if (Math.Abs(n[r, col]) > Math.Abs(n[pivot, col]))
                {
                    pivot = r;
                }
            }

            for (var c = 0; c <= m; c++)
            {
                (n[col, c], n[pivot, c]) = (n[pivot, c], n[col, c]);
            }

            for (var r = col + 1; r < m; r++)
            {
                var factor = n[r, col] / n[col, col];
                for (var c = col; c <= m; c++)
                {
                    n[r, c] -= factor * n[col, c];
                }
            }
        }

        var x = new double[m];
        for (var r = m - 1; r >= 0; r--)
        {
            var s = n[r, m];
            for (var c = r + 1; c < m; c++)
            {
                s -= n[r, c] * x[c];
            }

            x[r] = s / n[r, r];
        }

        return x;
    }
}
