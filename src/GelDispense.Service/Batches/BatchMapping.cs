using GelDispense.Contracts.V1;
using GelDispense.Service.Storage;
using Google.Protobuf;
using Google.Protobuf.WellKnownTypes;

namespace GelDispense.Service.Batches;

/// <summary>Stored rows as contract messages.</summary>
public static class BatchMapping
{
    public static BatchStatus Status(string stored) =>
        System.Enum.TryParse<BatchStatus>(stored, out var status) ? status : BatchStatus.Unspecified;

    public static string Stored(BatchStatus status) => status.ToString();

    public static Batch ToContract(BatchRow row, IEnumerable<AdditionRow> additions, IEnumerable<CorrectionRow> corrections)
    {
        var recipe = JsonParser.Default.Parse<Recipe>(row.RecipeBody);
        var setup = JsonParser.Default.Parse<CreateBatchRequest>(row.Setup);
        var plan = JsonParser.Default.Parse<DispensingPlan>(row.Plan);
        var batch = new Batch
        {
            Id = row.Id,
            Status = Status(row.Status),
            StationId = row.StationId,
            RecipeName = row.RecipeName,
            RecipeRevision = (int)row.RecipeRevision,
            Recipe = recipe,
            Spec = recipe.Spec,
            Balance = setup.Balance,
            Pipette = setup.Pipette,
            Air = setup.Air,
            Options = setup.Options,
            CreatedAt = Timestamp.FromDateTimeOffset(TimeText.Parse(row.CreatedAt)),
            UpdatedAt = Timestamp.FromDateTimeOffset(TimeText.Parse(row.UpdatedAt)),
            AbortReason = row.AbortReason,
            Version = row.Version,
            LastEventSequence = row.LastEventSeq,
            PlanRevision = (int)row.PlanRevision,
        };
        batch.Steps.AddRange(plan.Steps);
        batch.Additions.AddRange(Effective(additions.OrderBy(a => a.Ordinal), corrections));
        return batch;
    }

    /// <summary>
    /// Additions as they read now: each with its latest correction's reading, true mass and window flag (corrections
    /// in event order), the first reading kept in <see cref="Addition.OriginalReadingG"/>.
    /// </summary>
    public static IEnumerable<Addition> Effective(IEnumerable<AdditionRow> additions, IEnumerable<CorrectionRow> corrections)
    {
        var byAddition = corrections.ToLookup(c => c.AdditionId, StringComparer.Ordinal);
        return additions.Select(a => Corrected(ToContract(a), [.. byAddition[a.AdditionId]]));
    }

    /// <summary>The addition with the last of <paramref name="corrections"/> (oldest first) applied.</summary>
    public static Addition Corrected(Addition addition, IReadOnlyList<CorrectionRow> corrections)
    {
        if (corrections.Count == 0)
        {
            return addition;
        }

        var latest = corrections[^1];
        addition.ReadingG = latest.ReadingG;
        addition.TrueMassG = latest.TrueMassG;
        addition.WithinWindow = latest.WithinWindow;
        addition.CorrectionCount = corrections.Count;
        addition.LatestCorrection = ToContract(latest);
        return addition;
    }

    public static AdditionCorrection ToContract(CorrectionRow row) => new()
    {
        CorrectionId = row.CorrectionId,
        AdditionId = row.AdditionId,
        Sequence = row.Seq,
        CorrectsSequence = row.CorrectsSeq,
        PreviousReadingG = row.PreviousReadingG,
        ReadingG = row.ReadingG,
        TrueMassG = row.TrueMassG,
        WithinWindow = row.WithinWindow,
        Reason = row.Reason,
        ActorKeyId = row.ActorKeyId,
        StationId = row.StationId,
        CorrectedAt = Timestamp.FromDateTimeOffset(TimeText.Parse(row.RecordedAt)),
    };

    public static Addition ToContract(AdditionRow row) => new()
    {
        AdditionId = row.AdditionId,
        StepIndex = (int)row.StepIndex,
        ReadingG = row.ReadingG,
        Stable = row.Stable,
        Source = row.Source,
        LotId = row.LotId,
        TrueMassG = row.TrueMassG,
        WithinWindow = row.WithinWindow,
        RecordedAt = Timestamp.FromDateTimeOffset(TimeText.Parse(row.RecordedAt)),
        PlanRevision = (int)row.PlanRevision,
        TargetMassG = row.TargetMassG,
        AcceptanceG = row.AcceptanceG,
        OriginalReadingG = row.ReadingG,
    };

    public static BatchEvent ToContract(EventRow row)
    {
        var batchEvent = JsonParser.Default.Parse<BatchEvent>(row.Body);
        batchEvent.Sequence = row.Seq;
        if (batchEvent.Correction is { } correction)
        {
            // The body is written before the event has its sequence.
            correction.Sequence = row.Seq;
            batchEvent.Addition.LatestCorrection = correction;
        }

        return batchEvent;
    }
}
