namespace GelDispense.Service.Storage;

/// <summary>What creating a batch writes: the recipe revision (reused when unchanged), the batch and its first event, written by <see cref="ActorKeyId"/>.</summary>
public sealed record NewBatch(
    string Id,
    string StationId,
    string RecipeName,
    string RecipeBody,
    string RecipeHash,
    string Setup,
    string Plan,
    string Status,
    string EventType,
    string EventBody,
    DateTimeOffset At,
    string ActorKeyId);
