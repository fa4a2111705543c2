using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Offline;

/// <summary>
/// What the station works out by itself for an addition while the service is away: the true mass, whether it is in
/// its window and, after an out-of-window addition, the re-planned remaining steps with the predicted composition.
/// </summary>
public sealed record LocalOutcome(
    double TrueMassG,
    bool WithinWindow,
    IReadOnlyList<PlanStep> RemainingSteps,
    Composition? PredictedFinal,
    IReadOnlyList<string> Warnings);
