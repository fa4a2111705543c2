using GelDispense.Chemistry.Composition;

namespace GelDispense.Chemistry.Tolerances;

/// <summary>Builds the spec quantities of a formulation from its spec, each as a ratio of linear forms in line order.</summary>
public static class SpecQuantities
{
    public const string HydrolysisRatio = "hydrolysisRatio";
    public const string OxideDensity = "oxideDensityGPerMl";

    public static IReadOnlyList<SpecQuantity> For(Formulation formulation, FormulationSpec? spec)
    {
        var result = new List<SpecQuantity>();
        if (spec is null)
        {
            return result;
        }

        var lines = formulation.Lines;
        var precursor = Per(lines, l => l.Reagent.PrecursorMolPerG);
        if (spec.HydrolysisRatio is { } r)
        {
            result.Add(new SpecQuantity(HydrolysisRatio, r, Per(lines, l => l.Reagent.WaterMolPerG), precursor));
        }

        if (spec.OxideDensityGPerMl is { } d)
        {
            result.Add(new SpecQuantity(OxideDensity, d, Per(lines, l => l.Reagent.OxideGPerG), Per(lines, l => l.VolumeMlPerG)));
        }

        foreach (var ratio in spec.Ratios)
        {
            var numerator = Per(lines, l => string.Equals(l.ReagentId, ratio.ReagentId, StringComparison.OrdinalIgnoreCase) ? l.Reagent.ActiveMolPerG : 0);
            result.Add(new SpecQuantity($"ratio:{ratio.ReagentId}", ratio.Target, numerator, precursor));
        }

        return result;
    }

    private static double[] Per(IReadOnlyList<FormulationLine> lines, Func<FormulationLine, double> perG) => [.. lines.Select(perG)];
}
