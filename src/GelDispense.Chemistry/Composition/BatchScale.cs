namespace GelDispense.Chemistry.Composition;

/// <summary>
/// The batch size. When a recipe has a scale, its amounts give proportions only: the whole recipe is
/// multiplied so that the named quantity comes out at <see cref="Value"/>.
/// </summary>
public sealed record BatchScale(ScaleBasis Basis, double Value);
