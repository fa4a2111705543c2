namespace GelDispense.Service.Storage;

/// <summary>One re-plan of a batch, stored once and never changed. <see cref="Plan"/> is a DispensingPlan in protobuf JSON.</summary>
public sealed class PlanRevisionRow
{
    public string BatchId { get; init; } = "";
    public long Revision { get; init; }
    public string Plan { get; init; } = "";
    /// <summary>Final batch size relative to the batch as first planned.</summary>
    public double ScaleFactor { get; init; }
    /// <summary>The out-of-window addition that caused the re-plan, or the addition whose correction did.</summary>
    public string CauseAdditionId { get; init; } = "";
    public string CreatedAt { get; init; } = "";
}
