namespace GelDispense.Service.Storage;

/// <summary>One stored addition. <see cref="Response"/> is the RecordAdditionResponse a replay returns unchanged (see Batches.StoredResponse).</summary>
public sealed class AdditionRow
{
    public string BatchId { get; init; } = "";
    public string AdditionId { get; init; } = "";
    /// <summary>0-based position among the batch's additions, in the order the service accepted them.</summary>
    public long Ordinal { get; init; }
    public long StepIndex { get; init; }
    public double ReadingG { get; init; }
    public bool Stable { get; init; }
    public string Source { get; init; } = "";
    public string LotId { get; init; } = "";
    public double TrueMassG { get; init; }
    public bool WithinWindow { get; init; }
    public string RecordedAt { get; init; } = "";
    /// <summary>Hash of what the station sent; a replay with another hash is a conflict.</summary>
    public string ContentHash { get; init; } = "";
    /// <summary>Empty for rows written since the answer is kept as bytes; earlier rows hold their answer's text here.</summary>
    public string Response { get; init; } = "";
    /// <summary>
    /// The answer a replay returns, deflated protobuf (see Batches.StoredResponse); written with the addition, null in
    /// rows written before it and in bulk reads (<see cref="BatchStore.ResponseAsync"/> reads it).
    /// </summary>
    public byte[]? ResponseBytes { get; init; }
    /// <summary>The plan revision the addition was judged against.</summary>
    public long PlanRevision { get; init; }
    /// <summary>The step's target true mass in that revision.</summary>
    public double TargetMassG { get; init; }
    /// <summary>The step's acceptance band (half-width) in that revision.</summary>
    public double AcceptanceG { get; init; }
}
