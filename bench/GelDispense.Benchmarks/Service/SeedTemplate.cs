namespace GelDispense.Benchmarks.Service;

/// <summary>What every seeded batch copies from the batch the service created: recipe revision, setup and plan as stored.</summary>
public sealed record SeedTemplate(long RecipeRevisionId, string Setup, string Plan, string StationId);
