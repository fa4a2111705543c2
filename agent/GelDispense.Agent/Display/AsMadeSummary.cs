using System.Globalization;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Display;

/// <summary>
/// The as-made record put into words and rows once, for both displays: totals, one row per component, and every
/// deviation with its flag. R and the oxide density come first, since the spec is written in them.
/// </summary>
public sealed record AsMadeSummary(string Heading, IReadOnlyList<string> Totals, IReadOnlyList<string[]> Components, IReadOnlyList<string[]> Deviations, IReadOnlyList<string> Footer)
{
    public static readonly string[] ComponentColumns = ["reagent", "mass / g", "amount / mol", "volume / mL"];

    public static readonly string[] DeviationColumns = ["quantity", "nominal", "as made", "deviation", "tolerance", "flag"];

    public static AsMadeSummary From(AsMade asMade, string recipeName, string origin)
    {
        var c = asMade.Composition ?? new Composition();
        var totals = new[]
        {
            F($"R (water : precursor) = {c.HydrolysisRatio:0.000} mol/mol; oxide density = {c.OxideDensityGPerMl:0.0000} g/mL"),
            F($"gel volume {c.GelVolumeMl:0.00} mL at {c.TemperatureC:0.#} °C (ideal mixing), oxide {c.OxideMassG:0.000} g, total mass {c.TotalMassG:0.000} g"),
        };
        var components = c.Components.Select(x => new[] { x.ReagentId, F($"{x.MassG:0.0000}"), F($"{x.Moles:0.00000}"), F($"{x.VolumeMl:0.000}") }).ToArray();
        var deviations = asMade.Deviations
            .OrderBy(d => d.Quantity switch { "hydrolysisRatio" => 0, "oxideDensityGPerMl" => 1, _ => 2 })
            .Select(d => new[]
            {
                Label(d.Quantity), F($"{d.Nominal:0.#####}"), F($"{d.Actual:0.#####}"), $"{Grams.Signed(d.DeviationPct, 2)} %",
                d.HasTolerancePct ? F($"± {d.TolerancePct:0.##} %") : "—", d.WithinTolerance ? "OK" : "OUT",
            }).ToArray();
        var footer = new List<string>
        {
            $"Within spec: {(asMade.WithinSpec ? "yes" : "NO")}; complete: {(asMade.Complete ? "yes" : "no")}; steps made: {asMade.StepsDone}.",
        };
        footer.AddRange(asMade.Warnings);
        return new AsMadeSummary($"As-made composition of {recipeName} ({origin})", totals, components, deviations, footer);
    }

    /// <summary>The whole summary as plain lines, columns padded for a log.</summary>
    public IEnumerable<string> Lines()
    {
        yield return Heading;
        foreach (var line in Totals)
        {
            yield return "  " + line;
        }

        yield return "  " + string.Join("  ", ComponentColumns.Select((h, i) => i == 0 ? h.PadRight(12) : h.PadLeft(13)));
        foreach (var row in Components)
        {
            yield return "  " + string.Join("  ", row.Select((v, i) => i == 0 ? v.PadRight(12) : v.PadLeft(13)));
        }

        foreach (var row in Deviations)
        {
            yield return F($"  {row[0],-26} nominal {row[1],-9} as made {row[2],-9} {row[3],9} (tolerance {row[4]})  {row[5]}");
        }

        foreach (var line in Footer)
        {
            yield return "  " + line;
        }
    }

    private static string Label(string quantity) => quantity switch
    {
        "hydrolysisRatio" => "R (water : precursor)",
        "oxideDensityGPerMl" => "oxide density / (g/mL)",
        _ when quantity.StartsWith("ratio:", StringComparison.Ordinal) => $"{quantity[6..]} : precursor",
        _ => quantity,
    };

    private static string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
