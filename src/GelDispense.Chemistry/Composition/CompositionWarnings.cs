using System.Globalization;

namespace GelDispense.Chemistry.Composition;

/// <summary>Plain-word warnings about a composition: the model's assumptions and what a formulator could miss.</summary>
internal static class CompositionWarnings
{
    public const string IdealMixing =
        "Gel volume assumes ideal mixing (volumes add) and no volume change on gelation; alcohol–water mixtures contract by up to about 3 %, so the true oxide density is slightly higher.";

    public static IReadOnlyList<string> For(Formulation f, CompositionTotals totals)
    {
        var warnings = new List<string> { IdealMixing };
        var g = totals.MeanHydrolysableGroups;
        var regime = CompositionEvaluator.RegimeOf(totals);
        if (regime == HydrolysisRegime.BelowStoichiometric)
        {
            warnings.Add($"R = {F(totals.HydrolysisRatio)} is below g/2 = {F(g / 2)}: there is not enough water to convert all alkoxide to oxide (normal for the first stage of a two-step sol only).");
        }
        else if (regime == HydrolysisRegime.RelyingOnCondensationWater)
        {
            warnings.Add($"R = {F(totals.HydrolysisRatio)} lies between g/2 = {F(g / 2)} and g = {F(g)}: full conversion relies on water released by condensation.");
        }

        foreach (var line in f.Lines)
        {
            var r = line.Reagent;
            var water = f.MassesG[line.Index] * r.WaterMolPerG;
            if (water > 0 && r.Definition.Role != Reagents.ReagentRole.Water && totals.PrecursorMol > 0)
            {
                warnings.Add($"Water in '{r.Id}' adds {F(water / totals.PrecursorMol)} to R ({F(water * 18.015)} g of water).");
            }

            if (f.MassesG[line.Index] == 0)
            {
                warnings.Add($"Component {line.Index + 1} ('{r.Id}') has a zero amount.");
            }
        }

        return warnings;
    }

    private static string F(double v) => v.ToString("0.####", CultureInfo.InvariantCulture);
}
