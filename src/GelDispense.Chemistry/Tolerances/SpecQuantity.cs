using GelDispense.Chemistry.Composition;

namespace GelDispense.Chemistry.Tolerances;

/// <summary>
/// A spec quantity written as a ratio of two linear forms of the step masses, Q(m) = (a·m)/(b·m):
/// R is water/precursor, the oxide density is oxide/volume, a mole ratio is component/precursor. The
/// denominator is positive for any non-negative masses that contain the denominator's species.
/// </summary>
public sealed class SpecQuantity
{
    public SpecQuantity(string name, SpecTarget target, double[] numeratorPerG, double[] denominatorPerG)
    {
        Name = name;
        Target = target;
        NumeratorPerG = numeratorPerG;
        DenominatorPerG = denominatorPerG;
    }

    /// <summary>"hydrolysisRatio", "oxideDensityGPerMl" or "ratio:{reagentId}".</summary>
    public string Name { get; }

    public SpecTarget Target { get; }

    public double[] NumeratorPerG { get; }

    public double[] DenominatorPerG { get; }

    public double Evaluate(ReadOnlySpan<double> massesG)
    {
        double a = 0, b = 0;
        for (var i = 0; i < massesG.Length; i++)
        {
            a += NumeratorPerG[i] * massesG[i];
            b += DenominatorPerG[i] * massesG[i];
        }

        return a / b;
    }

    /// <summary>∂Q/∂m_i = (a_i − Q·b_i) / (b·m) for every step, from one pass over the masses.</summary>
    public void Sensitivities(ReadOnlySpan<double> massesG, Span<double> into)
    {
        double a = 0, b = 0;
        for (var i = 0; i < massesG.Length; i++)
        {
            a += NumeratorPerG[i] * massesG[i];
            b += DenominatorPerG[i] * massesG[i];
        }

        var q = a / b;
        for (var i = 0; i < massesG.Length; i++)
        {
            into[i] = (NumeratorPerG[i] - q * DenominatorPerG[i]) / b;
        }
    }
}
