using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Station;

/// <summary>
/// What a run starts from: a recipe (a new batch, planned by the service for these devices) or the id of a batch
/// already under way. Exactly one of <see cref="Recipe"/> and <see cref="BatchId"/> is set.
/// </summary>
public sealed record BatchStart(Recipe? Recipe, string? BatchId, BalanceProfile Balance, PipetteProfile? Pipette = null, AirConditions? Air = null, PlanOptions? Options = null);
