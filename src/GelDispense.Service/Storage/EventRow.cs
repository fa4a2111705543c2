namespace GelDispense.Service.Storage;

/// <summary>One entry of the batch event log; <see cref="Body"/> is a BatchEvent in protobuf JSON without its sequence.</summary>
public sealed class EventRow
{
    public long Seq { get; init; }
    public string BatchId { get; init; } = "";
    public string Type { get; init; } = "";
    public string Body { get; init; } = "";
    public string OccurredAt { get; init; } = "";
}
