namespace GelDispense.Service.Storage;

/// <summary>
/// One entry of the batch event log; <see cref="Body"/> is a BatchEvent in protobuf JSON without its sequence.
/// The audit columns say who wrote it, at which station and which addition or correction it records, and chain it to the
/// batch's previous event (see <see cref="AuditChain"/>).
/// </summary>
public sealed class EventRow
{
    public long Seq { get; init; }
    public string BatchId { get; init; } = "";
    public string Type { get; init; } = "";
    public string Body { get; init; } = "";
    public string OccurredAt { get; init; } = "";
    /// <summary>The API key id (or token subject) of the caller that caused the event.</summary>
    public string ActorKeyId { get; init; } = "";
    public string StationId { get; init; } = "";
    /// <summary>The addition an ADDITION_RECORDED event records; empty for other events.</summary>
    public string AdditionId { get; init; } = "";
    /// <summary>The correction an ADDITION_CORRECTED event records; empty for other events.</summary>
    public string CorrectionId { get; init; } = "";
    public string PrevHash { get; init; } = "";
    public string Hash { get; init; } = "";
}
