using System.Globalization;
using FsCheck;
using FsCheck.Fluent;
using GelDispense.Chemistry.Formulas;

namespace GelDispense.Chemistry.Tests.Formulas;

/// <summary>Random formulas as lists of (element, whole count) terms, written out with every count explicit.</summary>
internal static class FormulaGen
{
    private static readonly string[] Symbols = [.. AtomicWeights.Symbols.Order(StringComparer.Ordinal)];

    public static Gen<(string Symbol, int Count)[]> Terms { get; } =
        Gen.Choose(1, 8).SelectMany(length => Gen.Zip(Gen.Elements(Symbols), Gen.Choose(1, 40)).ArrayOf(length));

    public static string Text(IEnumerable<(string Symbol, int Count)> terms) =>
        string.Concat(terms.Select(t => t.Symbol + t.Count.ToString(CultureInfo.InvariantCulture)));
}
