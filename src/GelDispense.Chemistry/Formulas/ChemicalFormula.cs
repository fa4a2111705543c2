using System.Collections.Frozen;
using System.Globalization;

namespace GelDispense.Chemistry.Formulas;

/// <summary>
/// A parsed formula: how many atoms of each element one formula unit holds (counts may be fractional,
/// as in AlO1.5 for half a mole of Al2O3) and the molar mass they add up to.
/// </summary>
public sealed class ChemicalFormula
{
    internal ChemicalFormula(string text, IReadOnlyDictionary<string, double> atoms)
    {
        Text = text;
        Atoms = atoms.ToFrozenDictionary(StringComparer.Ordinal);
        MolarMassGPerMol = Atoms.Sum(a => a.Value * Weight(a.Key));
    }

    public string Text { get; }

    public IReadOnlyDictionary<string, double> Atoms { get; }

    /// <summary>Sum of atom counts times IUPAC standard atomic weights (<see cref="AtomicWeights"/>).</summary>
    public double MolarMassGPerMol { get; }

    public double Count(string element) => Atoms.TryGetValue(element, out var n) ? n : 0;

    public static ChemicalFormula Parse(string text, string field = "formula") => FormulaParser.Parse(text, field);

    public override string ToString() =>
        $"{Text} ({MolarMassGPerMol.ToString("0.###", CultureInfo.InvariantCulture)} g/mol)";

    private static double Weight(string symbol) =>
        AtomicWeights.TryGet(symbol, out var w) ? w : throw new InvalidOperationException($"Unknown element {symbol}.");
}
