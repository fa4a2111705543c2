using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Reagents;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Mapping;

/// <summary>
/// Turns a contract recipe into the chemistry library's, reporting every problem at once with JSON field paths
/// (recipe.components[2].amount.unit). Amount values, reagents and temperatures are checked by the library.
/// </summary>
public static class RecipeMapping
{
    public const int MaxComponents = Formulation.MaxComponents;
    public const int MaxInlineReagents = 32;
    public const int MaxNameLength = 200;

    public static Recipe ToChemistry(Contract.Recipe? recipe, string field = "recipe")
    {
        if (recipe is null)
        {
            throw new InvalidInputException(field, "", "a recipe is required");
        }

        var errors = new List<InputError>();
        if (string.IsNullOrWhiteSpace(recipe.Name) || recipe.Name.Length > MaxNameLength)
        {
            errors.Add(new InputError($"{field}.name", Clip(recipe.Name), $"a recipe needs a name of 1 to {MaxNameLength} characters"));
        }

        if (recipe.Components.Count > MaxComponents)
        {
            errors.Add(new InputError($"{field}.components", $"{recipe.Components.Count} components", $"a recipe may have at most {MaxComponents} components"));
        }

        if (recipe.InlineReagents.Count > MaxInlineReagents)
        {
            errors.Add(new InputError($"{field}.inlineReagents", $"{recipe.InlineReagents.Count} reagents", $"a recipe may define at most {MaxInlineReagents} inline reagents"));
        }

        if (errors.Count > 0)
        {
            throw new InvalidInputException(errors);
        }

        var components = recipe.Components.Select((c, i) => Component(c, $"{field}.components[{i}]", errors)).ToArray();
        var inline = recipe.InlineReagents.Select((r, i) => ReagentMapping.ToChemistry(r, $"{field}.inlineReagents[{i}]", errors))
            .OfType<Reagent>().ToArray();
        var scale = Scale(recipe.Scale, $"{field}.scale", errors);
        var spec = SpecMapping.ToChemistry(recipe.Spec, $"{field}.spec", errors);
        if (errors.Count > 0)
        {
            throw new InvalidInputException(errors);
        }

        return new Recipe
        {
            Name = recipe.Name.Trim(),
            TemperatureC = recipe.HasTemperatureC ? recipe.TemperatureC : 20,
            Components = components,
            InlineReagents = inline,
            Scale = scale,
            Spec = spec,
            LinearShrinkage = recipe.HasLinearShrinkage ? recipe.LinearShrinkage : null,
        };
    }

    private static RecipeComponent Component(Contract.RecipeComponent component, string field, List<InputError> errors)
    {
        var amount = component.Amount;
        if (amount is null)
        {
            errors.Add(new InputError($"{field}.amount", "", "an amount ({ value, unit }) is required"));
        }

        var unit = amount is null ? null : UnitNames.ParseUnit(amount.Unit);
        if (amount is not null && unit is null)
        {
            errors.Add(new InputError($"{field}.amount.unit", Clip(amount.Unit), $"unknown unit; use one of {UnitNames.AcceptedUnits}"));
        }

        return new RecipeComponent(component.ReagentId, new Amount(amount?.Value ?? 0, unit ?? AmountUnit.G), component.HasStage ? component.Stage : 1);
    }

    private static BatchScale? Scale(Contract.BatchScale? scale, string field, List<InputError> errors)
    {
        switch (scale?.SizeCase)
        {
            case null:
                return null;
            case Contract.BatchScale.SizeOneofCase.GelVolumeMl:
                return new BatchScale(ScaleBasis.GelVolumeMl, scale.GelVolumeMl);
            case Contract.BatchScale.SizeOneofCase.PrecursorMol:
                return new BatchScale(ScaleBasis.PrecursorMol, scale.PrecursorMol);
            case Contract.BatchScale.SizeOneofCase.OxideMassG:
                return new BatchScale(ScaleBasis.OxideMassG, scale.OxideMassG);
            default:
                errors.Add(new InputError(field, "{}", "set exactly one of gelVolumeMl, precursorMol, oxideMassG"));
                return null;
        }
    }

    internal static string Clip(string text) => text.Length <= 80 ? text : string.Concat(text.AsSpan(0, 80), "…");
}
