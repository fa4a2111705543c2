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
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"R = {totals.HydrolysisRatio:0.####} is below g/2 = {g / 2:0.####}: there is not enough water to convert all alkoxide to oxide (normal for the first stage of a two-step sol only)."));
        }
        else if (regime == HydrolysisRegime.RelyingOnCondensationWater)
        {
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"R = {totals.HydrolysisRatio:0.####} lies between g/2 = {g / 2:0.####} and g = {g:0.####}: full conversion relies on water released by condensation."));
        }

        for (var i = 0; i < f.Lines.Count; i++)
        {
            var line = f.Lines[i];
            var r = line.Reagent;
            var water = f.MassesG[line.Index] * r.WaterMolPerG;
            if (water > 0 && r.Definition.Role != Reagents.ReagentRole.Water && totals.PrecursorMol > 0)
            {
                warnings.Add(string.Create(CultureInfo.InvariantCulture, $"Water in '{r.Id}' adds {water / totals.PrecursorMol:0.####} to R ({water * 18.015:0.####} g of water)."));
            }

            if (f.MassesG[line.Index] == 0)
            {
                warnings.Add($"Component {line.Index + 1} ('{r.Id}') has a zero amount.");
            }
        }

        return warnings;
    }
}
