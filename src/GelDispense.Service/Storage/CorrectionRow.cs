namespace GelDispense.Service.Storage;

/// <summary>
/// One stored correction of an addition's reading (never changed once written). <see cref="Response"/> is the
/// CorrectAdditionResponse a replay returns; <see cref="Seq"/> is read from its event, not stored in the row.
/// </summary>
public sealed record CorrectionRow
{
    public string BatchId { get; init; } = "";
    public string CorrectionId { get; init; } = "";
    public string AdditionId { get; init; } = "";
    /// <summary>Sequence of the event this correction supersedes (the addition's event, or its latest earlier correction's).</summary>
    public long CorrectsSeq { get; init; }
    public double PreviousReadingG { get; init; }
    public double ReadingG { get; init; }
    public double TrueMassG { get; init; }
    public bool WithinWindow { get; init; }
    public string Reason { get; init; } = "";
    public string ActorKeyId { get; init; } = "";
    public string StationId { get; init; } = "";
    public string RecordedAt { get; init; } = "";
    /// <summary>Hash of what the caller sent; a replay with another hash is a conflict.</summary>
    public string ContentHash { get; init; } = "";
    /// <summary>Written with the correction; bulk reads leave it empty.</summary>
    public string Response { get; init; } = "";
    /// <summary>Sequence of this correction's ADDITION_CORRECTED event; 0 before it is written.</summary>
    public long Seq { get; init; }
}
