using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Tolerances;

namespace GelDispense.Chemistry.Planning;

/// <summary>
/// The gravimetric plan: steps in addition order, the composition they should give, whether the station
/// can hold the spec, and the smallest batch multiple at which it can (null when no size fits the balance).
/// </summary>
public sealed record DispensingPlan
{
    public required Formulation Formulation { get; init; }

    public required IReadOnlyList<PlanStep> Steps { get; init; }

    public required SolComposition Predicted { get; init; }

    public required IReadOnlyList<SpecCheck> SpecChecks { get; init; }

    public required bool Feasible { get; init; }

    /// <summary>Factor on the batch size at which every step becomes feasible; 1 when it already is.</summary>
    public required double? MinimumBatchScale { get; init; }

    public required double AirDensityKgPerM3 { get; init; }

    public required ToleranceMode Mode { get; init; }

    public required bool Cumulative { get; init; }

    public required IReadOnlyList<string> Warnings { get; init; }
}
