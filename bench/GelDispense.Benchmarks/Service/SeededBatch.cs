using System.Globalization;
using GelDispense.Contracts.V1;
using GelDispense.Service.Batches;
using GelDispense.Service.Storage;
using Google.Protobuf;
using Google.Protobuf.WellKnownTypes;

namespace GelDispense.Benchmarks.Service;

/// <summary>
/// One made batch of the seeded history, the same every time for the same index: its row, its additions at the
/// plan's target readings with a balance's scatter (two top-ups after the plan's steps), and its events, numbered
/// <c>firstSeq + k * groupSize + position</c> for event k so the batches of a group interleave in the log. Its
/// clock moves on by <see cref="EventSpacing"/> per event and starts <see cref="StationStagger"/> after the group's
/// previous station, so event times rise with the sequence.
/// </summary>
public sealed class SeededBatch
{
    public const int EventsPerBatch = HistorySeeder.AdditionsPerBatch + 2;
    public static readonly TimeSpan EventSpacing = TimeSpan.FromMinutes(3);
    public static readonly TimeSpan StationStagger = TimeSpan.FromSeconds(20);

    private readonly long _firstSeq;
    private readonly int _groupSize;
    private readonly int _position;

    public SeededBatch(int index, SeedTemplate template, IReadOnlyList<PlanStep> steps, DateTimeOffset groupStart, long firstSeq, int groupSize, int position)
    {
        var random = new Random(index);
        _firstSeq = firstSeq;
        _groupSize = groupSize;
        _position = position;
        StationId = $"st-{index % HistorySeeder.StationCount:00}";
        Template = template;
        Setup = template.Setup.Replace(template.StationId, StationId, StringComparison.Ordinal);
        CreatedAt = groupStart + (StationStagger * position);
        Id = $"b-{CreatedAt.UtcDateTime:yyyyMMdd-HHmmss}-{random.NextInt64(1L << 40):x10}";
        // About one batch in thirty is aborted after its last addition (say the sol gelled early).
        Status = random.Next(30) == 0 ? BatchStatus.Aborted : BatchStatus.Completed;
        Additions = [.. Enumerable.Range(0, HistorySeeder.AdditionsPerBatch).Select(k => NewAddition(k, steps[k < steps.Count ? k : random.Next(steps.Count)], random))];
    }

    public string Id { get; }

    public string StationId { get; }

    public string Setup { get; }

    public SeedTemplate Template { get; }

    public DateTimeOffset CreatedAt { get; }

    public BatchStatus Status { get; }

    public IReadOnlyList<AdditionRow> Additions { get; }

    public long LastEventSeq => Seq(EventsPerBatch - 1);

    public string UpdatedAt => TimeText.Format(At(EventsPerBatch - 1));

    /// <summary>Event k: created, then one per addition, then completed or aborted.</summary>
    public (EventRow Row, AdditionRow? Addition) Event(int k)
    {
        var at = At(k);
        var addition = k is > 0 and <= HistorySeeder.AdditionsPerBatch ? Additions[k - 1] : null;
        var status = k == EventsPerBatch - 1 ? Status : BatchStatus.InProgress;
        var type = k == 0 ? BatchEventType.Created : addition is null ? (status == BatchStatus.Completed ? BatchEventType.Completed : BatchEventType.Aborted) : BatchEventType.AdditionRecorded;
        var body = new BatchEvent { BatchId = Id, Type = type, OccurredAt = Timestamp.FromDateTimeOffset(at), Status = status };
        if (addition is not null)
        {
            body.Addition = BatchMapping.ToContract(addition);
        }

        return (new EventRow
        {
            Seq = Seq(k), BatchId = Id, Type = addition is null ? type.ToString() : "ADDITION_RECORDED", Body = JsonFormatter.Default.Format(body),
            OccurredAt = TimeText.Format(at), ActorKeyId = $"key-{StationId}", StationId = StationId, AdditionId = addition?.AdditionId ?? "",
        }, addition);
    }

    private long Seq(int k) => _firstSeq + ((long)k * _groupSize) + _position;

    private DateTimeOffset At(int k) => CreatedAt + (EventSpacing * k);

    private AdditionRow NewAddition(int k, PlanStep step, Random random)
    {
        // A 1 mg balance's scatter around the target; the top-ups after the plan are small.
        var readingG = k < HistorySeeder.AdditionsPerBatch - 2 ? step.TargetReadingG + ((random.NextDouble() - 0.5) * step.AcceptanceG) : 0.05 + random.Next(0, 200) * 0.001;
        return new AdditionRow
        {
            BatchId = Id, AdditionId = $"{Id}-a{k:00}", Ordinal = k, StepIndex = step.Index, ReadingG = Math.Round(readingG, 3), Stable = true, Source = "balance",
            LotId = $"LOT-{step.ReagentId.ToUpperInvariant()}-{CreatedAt:yyMM}", TrueMassG = Math.Round(readingG * 1.00105, 4), WithinWindow = k < HistorySeeder.AdditionsPerBatch - 2,
            RecordedAt = TimeText.Format(At(k + 1)), ContentHash = random.NextInt64().ToString("x16", CultureInfo.InvariantCulture),
            Response = "seeded", PlanRevision = 0, TargetMassG = step.TargetMassG, AcceptanceG = step.AcceptanceG,
        };
    }
}
