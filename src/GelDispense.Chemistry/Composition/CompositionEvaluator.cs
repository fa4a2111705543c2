using System.Globalization;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Reagents;

namespace GelDispense.Chemistry.Composition;

/// <summary>Evaluates a recipe (design §2): amounts, volumes, oxide, densities, R and its regime, ratios, stages.</summary>
public static class CompositionEvaluator
{
    public static SolComposition Evaluate(Recipe recipe, IReagentLookup catalog) =>
        Describe(Formulation.Prepare(recipe, catalog));

    /// <summary>Reports on a formulation as its masses stand (nominal, solved or as made).</summary>
    public static SolComposition Describe(Formulation formulation)
    {
        var recipe = formulation.Recipe;
        var totals = formulation.Totals();
        var lines = formulation.Lines;
        var components = new ComponentAmount[lines.Count];
        for (var i = 0; i < lines.Count; i++)
        {
            var m = formulation.MassesG[i];
            var r = lines[i].Reagent;
            var moles = m * r.ActiveMolPerG;
            components[i] = new ComponentAmount(r.Id, lines[i].Stage, m, moles, m * lines[i].VolumeMlPerG, m * r.WaterMolPerG,
                totals.PrecursorMol > 0 ? moles / totals.PrecursorMol : 0);
        }

        return new SolComposition
        {
            TemperatureC = recipe.TemperatureC,
            Totals = totals,
            Regime = RegimeOf(totals),
            DriedDensityGPerMl = DriedDensity(recipe.LinearShrinkage, totals.OxideDensityGPerMl),
            Components = components,
            Oxides = OxideShares(formulation, totals),
            Stages = StageSummaries(formulation),
            Warnings = CompositionWarnings.For(formulation, totals),
            Cautions = GhsStatements.Cautions(lines.Select(l => l.Reagent)),
        };
    }

    public static HydrolysisRegime RegimeOf(CompositionTotals totals)
    {
        // A relative margin keeps R written as exactly g/2 or g on the side it was written for.
        var g = totals.MeanHydrolysableGroups * (1 - 1e-9);
        var r = totals.HydrolysisRatio;
        return r < g / 2 ? HydrolysisRegime.BelowStoichiometric
            : r < g ? HydrolysisRegime.RelyingOnCondensationWater
            : HydrolysisRegime.FullHydrolysis;
    }

    /// <summary>Isotropic linear shrinkage s keeps the mass and shrinks the volume by (1 − s)³.</summary>
    public static double DriedDensityGPerMl(double wetOxideDensityGPerMl, double linearShrinkage) =>
        wetOxideDensityGPerMl / Math.Pow(1 - linearShrinkage, 3);

    private static double? DriedDensity(double? shrinkage, double wetDensity)
    {
        if (shrinkage is not { } s)
        {
            return null;
        }

        if (!double.IsFinite(s) || s < 0 || s >= 1)
        {
            throw new InvalidInputException("recipe.linearShrinkage", s.ToString("R", CultureInfo.InvariantCulture), "a linear shrinkage must be at least 0 and below 1");
        }

        return DriedDensityGPerMl(wetDensity, s);
    }

    private static OxideShare[] OxideShares(Formulation f, CompositionTotals totals)
    {
        var lines = f.Lines;
        var count = 0;
        var totalMetal = 0.0;
        for (var i = 0; i < lines.Count; i++)
        {
            if (lines[i].Reagent.OxideGPerG > 0)
            {
                count++;
                totalMetal += MetalMol(f, lines[i]);
            }
        }

        var shares = new OxideShare[count];
        for (int i = 0, k = 0; i < lines.Count; i++)
        {
            var l = lines[i];
            if (l.Reagent.OxideGPerG > 0)
            {
                var oxideG = f.MassesG[i] * l.Reagent.OxideGPerG;
                shares[k++] = new OxideShare(l.ReagentId, l.Reagent.OxideFormula!.Text, oxideG,
                    totals.OxideG > 0 ? oxideG / totals.OxideG : 0, totalMetal > 0 ? MetalMol(f, l) / totalMetal : 0);
            }
        }

        return shares;
    }

    private static double MetalMol(Formulation f, FormulationLine l) =>
        f.MassesG[l.Index] * l.Reagent.PrecursorMolPerG * l.Reagent.Definition.Precursor!.OxidePerMol * l.Reagent.NetworkAtomsPerOxideUnit;

    /// <summary>Each stage in ascending order, counting its own lines and those of earlier stages.</summary>
    private static StageSummary[] StageSummaries(Formulation f)
    {
        var lines = f.Lines;
        Span<int> stages = stackalloc int[lines.Count];
        var count = 0;
        for (var i = 0; i < lines.Count; i++)
        {
            if (!stages[..count].Contains(lines[i].Stage))
            {
                stages[count++] = lines[i].Stage;
            }
        }

        stages = stages[..count];
        stages.Sort();
        Span<double> masses = stackalloc double[lines.Count];
        var summaries = new StageSummary[count];
        for (var k = 0; k < count; k++)
        {
            for (var i = 0; i < masses.Length; i++)
            {
                masses[i] = lines[i].Stage <= stages[k] ? f.MassesG[i] : 0;
            }

            var t = CompositionTotals.From(lines, masses);
            summaries[k] = new StageSummary(stages[k], t.VolumeMl, t.PrecursorMol, t.WaterMol,
                t.PrecursorMol > 0 ? t.HydrolysisRatio : 0, t.VolumeMl > 0 ? t.OxideDensityGPerMl : 0, t.CatalystMolarityMolPerL);
        }

        return summaries;
    }
}
