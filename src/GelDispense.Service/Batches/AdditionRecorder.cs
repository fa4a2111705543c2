using System.Globalization;
using GelDispense.Chemistry.Errors;
using GelDispense.Contracts.V1;
using GelDispense.Service.Api;
using GelDispense.Service.Errors;
using GelDispense.Service.Mapping;
using GelDispense.Service.Storage;
using Google.Protobuf;
using Google.Protobuf.WellKnownTypes;

namespace GelDispense.Service.Batches;

/// <summary>
/// Records additions exactly once. The addition id is the idempotency key: the same content returns the stored
/// result, other content is refused (ALREADY_EXISTS). Concurrent additions to one batch are serialised by the
/// batch version; a writer that loses reads again, so nothing is lost or counted twice.
/// </summary>
public sealed class AdditionRecorder(BatchLedger ledger, BatchStore store, ReagentDirectory reagents, BatchEventSignal signal, TimeProvider time)
{
    public static readonly string[] Sources = ["balance", "manual", "dispenser"];

    public async Task<RecordAdditionResponse> RecordAsync(RecordAdditionRequest request, CancellationToken cancellationToken)
    {
        var source = Validate(request);
        var contentHash = BatchLedger.Hash(string.Join('|', request.StepIndex.ToString(CultureInfo.InvariantCulture),
            request.ReadingG.ToString("R", CultureInfo.InvariantCulture), request.Stable, source, request.LotId));
        for (var attempt = 0; ; attempt++)
        {
            var row = await ledger.FindAsync(request.BatchId, "batchId", cancellationToken);
            var additions = await store.AdditionsAsync([row.Id], cancellationToken);
            if (additions.FirstOrDefault(a => a.AdditionId == request.AdditionId) is { } earlier)
            {
                return Replay(earlier, contentHash);
            }

            BatchLedger.RequireInProgress(row, "batchId");
            var plan = JsonParser.Default.Parse<DispensingPlan>(row.Plan);
            var step = plan.Steps.FirstOrDefault(s => s.Index == request.StepIndex)
                ?? throw new InvalidInputException("stepIndex", request.StepIndex.ToString(CultureInfo.InvariantCulture),
                    $"the plan has no such step (steps 0 to {plan.Steps.Count - 1})");
            var recipe = JsonParser.Default.Parse<Recipe>(row.RecipeBody);
            var setup = JsonParser.Default.Parse<CreateBatchRequest>(row.Setup);
            var chemistry = await BatchChemistry.LoadAsync(recipe, setup.Air, reagents, cancellationToken);

            var at = time.GetUtcNow();
            var trueMassG = chemistry.TrueMassG(step, request.ReadingG);
            var addition = new Addition
            {
                AdditionId = request.AdditionId,
                StepIndex = request.StepIndex,
                ReadingG = request.ReadingG,
                Stable = request.Stable,
                Source = source,
                LotId = request.LotId,
                TrueMassG = trueMassG,
                WithinWindow = Math.Abs(trueMassG - step.TargetMassG) <= step.ToleranceG,
                RecordedAt = Timestamp.FromDateTimeOffset(at),
            };
            var all = additions.Select(BatchMapping.ToContract).Append(addition).ToArray();
            var response = new RecordAdditionResponse { Addition = addition, AsMade = chemistry.AsMade(row.Id, plan, all, recipe.Spec) };
            var stored = new AdditionRow
            {
                BatchId = row.Id, AdditionId = request.AdditionId, Ordinal = additions.Count, StepIndex = request.StepIndex,
                ReadingG = request.ReadingG, Stable = request.Stable, Source = source, LotId = request.LotId, TrueMassG = trueMassG,
                WithinWindow = addition.WithinWindow, RecordedAt = TimeText.Format(at), ContentHash = contentHash,
                Response = JsonFormatter.Default.Format(response),
            };
            var recorded = new BatchEvent
            {
                BatchId = row.Id, Type = BatchEventType.AdditionRecorded, OccurredAt = addition.RecordedAt, Addition = addition, Status = BatchStatus.InProgress,
            };
            var outcome = await store.TryAppendAdditionAsync(stored, row.Version, plan: null, JsonFormatter.Default.Format(recorded), at, cancellationToken);
            if (outcome.Written)
            {
                signal.Notify(row.Id);
                return response;
            }

            await ledger.PauseAsync(attempt, cancellationToken);
        }
    }

    public async Task<AsMade> AsMadeAsync(string batchId, CancellationToken cancellationToken)
    {
        var row = await ledger.FindAsync(batchId, "batchId", cancellationToken);
        var additions = await store.AdditionsAsync([row.Id], cancellationToken);
        var recipe = JsonParser.Default.Parse<Recipe>(row.RecipeBody);
        var setup = JsonParser.Default.Parse<CreateBatchRequest>(row.Setup);
        var chemistry = await BatchChemistry.LoadAsync(recipe, setup.Air, reagents, cancellationToken);
        return chemistry.AsMade(row.Id, JsonParser.Default.Parse<DispensingPlan>(row.Plan), [.. additions.Select(BatchMapping.ToContract)], recipe.Spec);
    }

    private static RecordAdditionResponse Replay(AdditionRow earlier, string contentHash)
    {
        if (earlier.ContentHash != contentHash)
        {
            throw ApiException.AlreadyExists("additionId", earlier.AdditionId,
                "this addition id was already recorded with other content; use a new id for a new addition");
        }

        var response = JsonParser.Default.Parse<RecordAdditionResponse>(earlier.Response);
        response.Replayed = true;
        return response;
    }

    private static string Validate(RecordAdditionRequest request)
    {
        var errors = new List<InputError>();
        if (request.AdditionId.Trim().Length is 0 or > 64)
        {
            errors.Add(new InputError("additionId", RecipeMapping.Clip(request.AdditionId), "an addition id (the idempotency key) has 1 to 64 characters"));
        }

        if (!double.IsFinite(request.ReadingG) || request.ReadingG < 0)
        {
            errors.Add(new InputError("readingG", ReagentMapping.Text(request.ReadingG), "a reading must be a finite number of zero or more grams; tare and weigh again"));
        }

        if (!request.Stable)
        {
            errors.Add(new InputError("stable", "false", "only a stable reading can be recorded; wait for the balance to settle"));
        }

        var source = request.Source.Length == 0 ? "balance" : request.Source.Trim().ToLowerInvariant();
        if (!Sources.Contains(source))
        {
            errors.Add(new InputError("source", RecipeMapping.Clip(request.Source), $"unknown source; use one of {string.Join(", ", Sources)}"));
        }

        if (request.LotId.Length > 64)
        {
            errors.Add(new InputError("lotId", RecipeMapping.Clip(request.LotId), "a lot id has at most 64 characters"));
        }

        return errors.Count == 0 ? source : throw new InvalidInputException(errors);
    }
}
