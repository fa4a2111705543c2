using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Journal;

/// <summary>
/// One journaled addition. <see cref="Sequence"/> is the journal's own order, which is the order of confirmation
/// and the order of replay. <see cref="Detail"/> says how the service answered (or why it refused).
/// </summary>
public sealed record JournalEntry(
    long Sequence,
    string AdditionId,
    string BatchId,
    int StepIndex,
    double ReadingG,
    string Source,
    string LotId,
    DateTimeOffset ConfirmedAt,
    JournalState State,
    DateTimeOffset? SettledAt,
    string Detail)
{
    /// <summary>The request that records this addition; the same bytes on every attempt, so a replay dedupes.</summary>
    public RecordAdditionRequest ToRequest() => new()
    {
        BatchId = BatchId,
        AdditionId = AdditionId,
        StepIndex = StepIndex,
        ReadingG = ReadingG,
        // Only stable readings are ever confirmed, so only stable readings are journaled.
        Stable = true,
        Source = Source,
        LotId = LotId,
    };
}
