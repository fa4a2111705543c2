namespace GelDispense.Chemistry.Reagents;

/// <summary>
/// A further part of a reagent as supplied, by mass fraction: the water in 37 % hydrochloric acid or the
/// 1-propanol in a 70 % zirconium propoxide solution. Water constituents count in R.
/// </summary>
public sealed record SolutionConstituent(string Formula, double MassFraction, ReagentRole Role);
