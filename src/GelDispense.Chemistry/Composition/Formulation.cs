using System.Globalization;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Reagents;

namespace GelDispense.Chemistry.Composition;

/// <summary>
/// A validated recipe resolved to masses of each reagent as supplied, at the batch scale. Everything
/// downstream (composition, spec solving, planning, as-made) works from these masses.
/// </summary>
public sealed class Formulation
{
    public const int MaxComponents = 64;

    private Formulation(Recipe recipe, FormulationLine[] lines, double[] massesG)
    {
        Recipe = recipe;
        Lines = lines;
        MassesG = massesG;
    }

    public Recipe Recipe { get; }

    public IReadOnlyList<FormulationLine> Lines { get; }

    /// <summary>Mass of each line's reagent as supplied, in recipe order.</summary>
    public IReadOnlyList<double> MassesG { get; }

    public CompositionTotals Totals() => CompositionTotals.From(Lines, ((double[])MassesG).AsSpan());

    /// <summary>The same lines with other masses (a solved, scaled or as-made variant).</summary>
    public Formulation WithMasses(double[] massesG) => new(Recipe, (FormulationLine[])Lines, massesG);

    /// <summary>Validates and resolves a recipe; throws <see cref="InvalidInputException"/> listing every problem found.</summary>
    public static Formulation Prepare(Recipe recipe, IReagentLookup catalog)
    {
        var errors = new List<InputError>();
        var lookup = PrepareInline(recipe, catalog, errors);
        var lines = ResolveLines(recipe, lookup, errors);
        if (errors.Count > 0)
        {
            throw new InvalidInputException(errors);
        }

        var masses = RecipeAmounts.ToMasses(recipe, lines);
        var formulation = new Formulation(recipe, lines, masses);
        return recipe.Scale is null ? formulation : formulation.ScaledTo(recipe.Scale, "recipe.scale");
    }

    /// <summary>Multiplies every mass so the named quantity reaches the scale's value.</summary>
    public Formulation ScaledTo(BatchScale scale, string field)
    {
        if (!double.IsFinite(scale.Value) || scale.Value <= 0)
        {
            throw new InvalidInputException($"{field}.value", Text(scale.Value), "a batch scale must be a positive number");
        }

        var totals = Totals();
        var current = scale.Basis switch
        {
            ScaleBasis.GelVolumeMl => totals.VolumeMl,
            ScaleBasis.PrecursorMol => totals.PrecursorMol,
            ScaleBasis.OxideMassG => totals.OxideG,
            _ => throw new InvalidInputException($"{field}.basis", scale.Basis.ToString(), "unknown scale basis"),
        };
        if (!(current > 0))
        {
            throw new InvalidInputException(field, scale.Basis.ToString(), "the recipe gives nothing of this quantity to scale by");
        }

        var factor = scale.Value / current;
        return WithMasses([.. MassesG.Select(m => m * factor)]);
    }

    private static IReagentLookup PrepareInline(Recipe recipe, IReagentLookup catalog, List<InputError> errors)
    {
        if (recipe.InlineReagents.Count == 0)
        {
            return catalog;
        }

        var inline = new List<PreparedReagent>();
        for (var i = 0; i < recipe.InlineReagents.Count; i++)
        {
            try
            {
                inline.Add(PreparedReagent.Prepare(recipe.InlineReagents[i], $"recipe.inlineReagents[{i}]"));
            }
            catch (InvalidInputException e)
            {
                errors.AddRange(e.Errors);
            }
        }

        return inline.Count == 0 ? catalog : new LayeredReagentLookup(inline, catalog);
    }

    private static FormulationLine[] ResolveLines(Recipe recipe, IReagentLookup lookup, List<InputError> errors)
    {
        if (!double.IsFinite(recipe.TemperatureC))
        {
            errors.Add(new("recipe.temperatureC", Text(recipe.TemperatureC), "a temperature must be a finite number"));
        }

        if (recipe.Components is null || recipe.Components.Count == 0)
        {
            errors.Add(new("recipe.components", "[]", "a recipe needs at least one component"));
            return [];
        }

        if (recipe.Components.Count > MaxComponents)
        {
            errors.Add(new("recipe.components", recipe.Components.Count.ToString(CultureInfo.InvariantCulture), $"a recipe may have at most {MaxComponents} components"));
            return [];
        }

        var lines = new FormulationLine[recipe.Components.Count];
        for (var i = 0; i < lines.Length; i++)
        {
            var c = recipe.Components[i];
            var reagent = c.ReagentId is null ? null : lookup.Find(c.ReagentId);
            if (reagent is null)
            {
                errors.Add(new(ComponentField(i, "reagentId"), c.ReagentId ?? "", "no such reagent in the catalog or the recipe's inline reagents"));
            }

            RecipeAmounts.Check(c.Amount, i, errors);
            if (c.Stage < 1)
            {
                errors.Add(new(ComponentField(i, "stage"), c.Stage.ToString(CultureInfo.InvariantCulture), "stages are numbered from 1"));
            }

            if (reagent is not null && double.IsFinite(recipe.TemperatureC) && !reagent.Definition.Density.Covers(recipe.TemperatureC))
            {
                var d = reagent.Definition.Density;
                errors.Add(new("recipe.temperatureC", Text(recipe.TemperatureC),
                    $"outside the density data of '{reagent.Id}' ({Text(d.MinTemperatureC)}–{Text(d.MaxTemperatureC)} °C)"));
            }
            else if (reagent is not null)
            {
                lines[i] = new FormulationLine(i, reagent, c.Stage, reagent.Definition.Density.DensityGPerMl(recipe.TemperatureC));
            }
        }

        if (errors.Count == 0 && !lines.Any(l => l.Reagent.PrecursorMolPerG > 0))
        {
            errors.Add(new("recipe.components", string.Join(",", lines.Select(l => l.ReagentId)), "no precursor: a sol needs at least one reagent with the precursor role"));
        }

        return lines;
    }

    internal static string Text(double v) => v.ToString("R", CultureInfo.InvariantCulture);

    /// <summary>"recipe.components[2].stage": worded only for an error, since every evaluation resolves every component.</summary>
    internal static string ComponentField(int index, string leaf) =>
        string.Create(CultureInfo.InvariantCulture, $"recipe.components[{index}].{leaf}");
}
