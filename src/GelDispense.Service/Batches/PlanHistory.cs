using System.Globalization;
using GelDispense.Chemistry.Errors;
using GelDispense.Contracts.V1;
using GelDispense.Service.Errors;
using GelDispense.Service.Security;
using GelDispense.Service.Storage;
using Google.Protobuf;
using Google.Protobuf.WellKnownTypes;

namespace GelDispense.Service.Batches;

/// <summary>A batch's plan revisions as stored: the first plan with the batch, each re-plan in its own append-only row.</summary>
public sealed class PlanHistory(BatchLedger ledger, BatchStore store)
{
    public async Task<PlanRevision> GetAsync(string batchId, int revision, Caller caller, CancellationToken cancellationToken)
    {
        var batch = await ledger.FindAsync(batchId, "batchId", cancellationToken);
        caller.RequireStation(batch.StationId, "batchId");
        if (revision < 0 || revision > batch.PlanRevision)
        {
            var text = revision.ToString(CultureInfo.InvariantCulture);
            throw new ApiException(Grpc.Core.StatusCode.NotFound, $"Batch {batch.Id} has no plan revision {text}.",
                [new InputError("revision", text, $"this batch has plan revisions 0 to {batch.PlanRevision}")]);
        }

        if (revision == 0)
        {
            // Not batch.Plan: that is the plan in force, the latest revision.
            var origin = await store.OriginAsync(batch.Id, cancellationToken)
                ?? throw new InvalidOperationException($"Batch {batch.Id} has no stored origin.");
            return Revision(batch.Id, 0, origin.FirstPlan, 1, "", batch.CreatedAt);
        }

        var row = await store.PlanRevisionAsync(batch.Id, revision, cancellationToken)
            ?? throw new InvalidOperationException($"Batch {batch.Id} points at plan revision {batch.PlanRevision}, but revision {revision} is not stored.");
        return Revision(batch.Id, revision, row.Plan, row.ScaleFactor, row.CauseAdditionId, row.CreatedAt);
    }

    private static PlanRevision Revision(string batchId, int revision, string plan, double scaleFactor, string cause, string createdAt) => new()
    {
        BatchId = batchId,
        Revision = revision,
        Plan = JsonParser.Default.Parse<DispensingPlan>(plan),
        ScaleFactor = scaleFactor,
        CauseAdditionId = cause,
        CreatedAt = Timestamp.FromDateTimeOffset(TimeText.Parse(createdAt)),
    };
}
