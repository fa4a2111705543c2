namespace GelDispense.Chemistry.Composition;

/// <summary>A number with its unit, as written in a recipe.</summary>
public readonly record struct Amount(double Value, AmountUnit Unit);
