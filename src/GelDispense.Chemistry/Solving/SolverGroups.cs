using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Reagents;

namespace GelDispense.Chemistry.Solving;

/// <summary>Which recipe lines the spec solver may change: the free solvent group and the pure water.</summary>
internal static class SolverGroups
{
    public static IReadOnlyList<int> FreeSolventLines(Formulation f, FormulationSpec spec)
    {
        if (spec.FreeSolventIds.Count > 0)
        {
            var lines = new List<int>();
            for (var k = 0; k < spec.FreeSolventIds.Count; k++)
            {
                var id = spec.FreeSolventIds[k];
                var matches = f.Lines.Where(l => string.Equals(l.ReagentId, id, StringComparison.OrdinalIgnoreCase)).ToArray();
                if (matches.Length == 0)
                {
                    throw new InvalidInputException($"recipe.spec.freeSolventIds[{k}]", id, "not a component of this recipe");
                }

                if (matches.Any(l => l.Reagent.PrecursorMolPerG > 0 || l.Reagent.WaterMolPerG > 0))
                {
                    throw new InvalidInputException($"recipe.spec.freeSolventIds[{k}]", id, "a free solvent may carry neither precursor nor water");
                }

                lines.AddRange(matches.Select(l => l.Index));
            }

            return lines;
        }

        var solvents = f.Lines.Where(l => l.Reagent.Definition.Role == ReagentRole.Solvent && l.Reagent.WaterMolPerG == 0).ToArray();
        if (solvents.Select(l => l.ReagentId.ToUpperInvariant()).Distinct().Count() != 1)
        {
            throw new InvalidInputException("recipe.spec.freeSolventIds", "",
                solvents.Length == 0 ? "the recipe has no solvent to adjust" : "the recipe has several solvents: name the free one(s)");
        }

        return [.. solvents.Select(l => l.Index)];
    }

    public static IReadOnlyList<int> WaterLines(Formulation f, IReadOnlyList<int> solventLines)
    {
        var water = f.Lines.Where(l => l.Reagent.Definition.Role == ReagentRole.Water && !solventLines.Contains(l.Index))
            .Select(l => l.Index).ToArray();
        return water.Length > 0
            ? water
            : throw new InvalidInputException("recipe.spec.hydrolysisRatio", "", "the recipe has no water component to adjust R with");
    }

    /// <summary>A group written with no amounts at all is taken in equal masses (one line: trivially its own proportion).</summary>
    public static void FillEmptyProportions(double[] masses, IReadOnlyList<int> group)
    {
        if (group.Count > 0 && group.All(i => masses[i] == 0))
        {
            foreach (var i in group)
            {
                masses[i] = 1;
            }
        }
    }
}
