using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Reagents;

namespace GelDispense.Chemistry.Solving;

/// <summary>
/// Solves the free solvent (and, when the spec names R, the water) so the sol meets its spec, then scales
/// to the batch size. Free solvents may carry no water (checked), so the two conditions solve in turn, exactly:
/// <code>
///   W_fixed + f·W_water = R·N_precursor
///   V_fixed + f·V_water + t·V_solvent = m_oxide / ρ_target
/// </code>
/// with f the water factor and t the solvent factor. Water from catalyst solutions sits in W_fixed, so R
/// counts it and the pure water is reduced to match.
/// </summary>
public static class SpecSolver
{
    public static SolvedRecipe Solve(Recipe recipe, IReagentLookup catalog)
    {
        var target = recipe.Spec?.OxideDensityGPerMl
            ?? throw new InvalidInputException("recipe.spec.oxideDensityGPerMl", "", "the spec solver needs a target oxide density");
        if (!double.IsFinite(target.Value) || target.Value <= 0)
        {
            throw new InvalidInputException("recipe.spec.oxideDensityGPerMl.value", Formulation.Text(target.Value), "a target density must be a positive number");
        }

        var formulation = Formulation.Prepare(recipe, catalog);
        var solvent = SolverGroups.FreeSolventLines(formulation, recipe.Spec!);
        var water = recipe.Spec!.HydrolysisRatio is null ? [] : SolverGroups.WaterLines(formulation, solvent);
        var masses = formulation.MassesG.ToArray();
        SolverGroups.FillEmptyProportions(masses, solvent);
        SolverGroups.FillEmptyProportions(masses, water);

        var all = formulation.WithMasses(masses).Totals();
        var s = Part(formulation, masses, solvent);
        var w = Part(formulation, masses, water);
        var fixedWater = all.WaterMol - w.WaterMol;
        var fixedVolume = all.VolumeMl - s.VolumeMl - w.VolumeMl;

        var waterFactor = 1.0;
        if (recipe.Spec.HydrolysisRatio is { } r)
        {
            var neededWater = r.Value * all.PrecursorMol - fixedWater;
            waterFactor = neededWater / w.WaterMol;
            if (!(waterFactor >= 0))
            {
                throw new InvalidInputException("recipe.spec.hydrolysisRatio.value", Formulation.Text(r.Value),
                    $"unreachable: the components other than water already bring R to {Formulation.Text(Math.Round(fixedWater / all.PrecursorMol, 4))}");
            }
        }

        var solventFactor = (all.OxideG / target.Value - fixedVolume - waterFactor * w.VolumeMl) / s.VolumeMl;
        if (!(solventFactor >= 0))
        {
            var highest = all.OxideG / (fixedVolume + waterFactor * w.VolumeMl);
            throw new InvalidInputException("recipe.spec.oxideDensityGPerMl.value", Formulation.Text(target.Value),
                $"unreachable: with no free solvent the highest reachable oxide density is {Formulation.Text(Math.Round(highest, 5))} g/mL");
        }

        foreach (var i in solvent)
        {
            masses[i] *= solventFactor;
        }

        foreach (var i in water)
        {
            masses[i] *= waterFactor;
        }

        var solved = formulation.WithMasses(masses);
        if (recipe.Scale is { } scale)
        {
            solved = solved.ScaledTo(scale, "recipe.scale");
        }

        var asMasses = recipe with
        {
            Components = [.. recipe.Components.Select((c, i) => c with { Amount = new Amount(solved.MassesG[i], AmountUnit.G) })],
            Scale = null,
        };
        return new SolvedRecipe(asMasses, solved, CompositionEvaluator.Describe(solved), waterFactor, solventFactor);
    }

    private static CompositionTotals Part(Formulation f, double[] masses, IReadOnlyList<int> indices)
    {
        var only = new double[masses.Length];
        foreach (var i in indices)
        {
            only[i] = masses[i];
        }

        return CompositionTotals.From(f.Lines, only);
    }
}
