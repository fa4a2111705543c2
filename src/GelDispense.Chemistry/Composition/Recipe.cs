using GelDispense.Chemistry.Reagents;

namespace GelDispense.Chemistry.Composition;

/// <summary>A formulation as the engineer writes it.</summary>
public sealed record Recipe
{
    public required string Name { get; init; }

    public required IReadOnlyList<RecipeComponent> Components { get; init; }

    /// <summary>Temperature at which volumes are stated and densities taken.</summary>
    public double TemperatureC { get; init; } = 20;

    /// <summary>Custom reagents for this recipe only; they take precedence over catalog reagents of the same id.</summary>
    public IReadOnlyList<Reagent> InlineReagents { get; init; } = [];

    public BatchScale? Scale { get; init; }

    public FormulationSpec? Spec { get; init; }

    /// <summary>Expected isotropic linear shrinkage on drying (0–1), for the predicted dried density.</summary>
    public double? LinearShrinkage { get; init; }
}
