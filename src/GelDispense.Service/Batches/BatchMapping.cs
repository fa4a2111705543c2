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

    public static Batch ToContract(BatchRow row, IEnumerable<AdditionRow> additions)
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
            CreatedAt = Timestamp.FromDateTimeOffset(TimeText.Parse(row.CreatedAt)),
            UpdatedAt = Timestamp.FromDateTimeOffset(TimeText.Parse(row.UpdatedAt)),
            AbortReason = row.AbortReason,
            Version = row.Version,
            LastEventSequence = row.LastEventSeq,
            PlanRevision = (int)row.PlanRevision,
        };
        batch.Steps.AddRange(plan.Steps);
        batch.Additions.AddRange(additions.OrderBy(a => a.Ordinal).Select(ToContract));
        return batch;
    }

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
    };

    public static BatchEvent ToContract(EventRow row)
    {
        var batchEvent = JsonParser.Default.Parse<BatchEvent>(row.Body);
        batchEvent.Sequence = row.Seq;
        return batchEvent;
    }
}
