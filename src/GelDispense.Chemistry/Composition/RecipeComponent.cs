namespace GelDispense.Chemistry.Composition;

/// <summary>One line of a recipe: which reagent, how much, and in which stage (1 = first) it goes in.</summary>
public sealed record RecipeComponent(string ReagentId, Amount Amount, int Stage = 1);
