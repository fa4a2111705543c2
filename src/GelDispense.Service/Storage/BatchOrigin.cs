namespace GelDispense.Service.Storage;

/// <summary>The parts of a batch fixed when it starts; bodies are protobuf JSON of contract messages.</summary>
public sealed class BatchOrigin
{
    public string Id { get; init; } = "";
    /// <summary>The <c>Recipe</c> message of the batch's recipe revision.</summary>
    public string RecipeBody { get; init; } = "";
    /// <summary>The <c>CreateBatchRequest</c> without its recipe: station, devices, air.</summary>
    public string Setup { get; init; } = "";
    /// <summary>The <c>DispensingPlan</c> made when the batch started (plan revision 0).</summary>
    public string FirstPlan { get; init; } = "";
}
