namespace GelDispense.Service.Storage;

/// <summary>A batch as stored, joined with its recipe revision. JSON columns hold protobuf JSON of contract messages.</summary>
public sealed class BatchRow
{
    public string Id { get; init; } = "";
    public string StationId { get; init; } = "";
    public string Status { get; init; } = "";
    public long RecipeRevisionId { get; init; }
    public string RecipeName { get; init; } = "";
    public long RecipeRevision { get; init; }
    /// <summary>The <c>Recipe</c> message of the revision.</summary>
    public string RecipeBody { get; init; } = "";
    /// <summary>The <c>CreateBatchRequest</c> without its recipe: station, devices, air.</summary>
    public string Setup { get; init; } = "";
    /// <summary>The <c>DispensingPlan</c> in force: revision <see cref="PlanRevision"/>, re-planned after out-of-window additions.</summary>
    public string Plan { get; init; } = "";
    public long PlanRevision { get; init; }
    public string AbortReason { get; init; } = "";
    public string CreatedAt { get; init; } = "";
    public string UpdatedAt { get; init; } = "";
    public long Version { get; init; }
    public long LastEventSeq { get; init; }
}
