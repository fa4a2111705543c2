using System.Globalization;
using GelDispense.Chemistry.Errors;
using GelDispense.Contracts.V1;
using GelDispense.Service.Api;
using GelDispense.Service.Errors;
using GelDispense.Service.Mapping;
using GelDispense.Service.Security;
using GelDispense.Service.Storage;
using Google.Protobuf;
using Google.Protobuf.WellKnownTypes;

namespace GelDispense.Service.Batches;

/// <summary>
/// Records additions exactly once. The addition id is the idempotency key: the same content returns the stored
/// result, other content is refused (ALREADY_EXISTS). Concurrent additions to one batch are serialised by the
/// batch version; a writer that loses reads again, so nothing is lost or counted twice.
/// </summary>
/// <remarks>
/// An addition is within window when its step is still to be made in the plan in force and the step's true mass so
/// far (this addition plus any earlier ones on the step, buoyancy-corrected) lies within the step's acceptance band
/// (<see cref="PlanStep.AcceptanceG"/>: the spec's window less the device's expected error) of its target. An
/// addition out of window re-plans the remaining steps; the re-plan is stored as the next plan revision in the same
/// transaction as the addition.
/// </remarks>
public sealed class AdditionRecorder(
    BatchLedger ledger, BatchStore store, BatchPlanCache plans, BatchProgressMemo memo, BatchEventSignal signal, TimeProvider time)
{
    public static readonly string[] Sources = ["balance", "manual", "dispenser"];

    public async Task<RecordAdditionResponse> RecordAsync(RecordAdditionRequest request, Caller caller, CancellationToken cancellationToken)
    {
        var source = Validate(request);
        var contentHash = BatchLedger.Hash(string.Join('|', request.StepIndex.ToString(CultureInfo.InvariantCulture),
            request.ReadingG.ToString("R", CultureInfo.InvariantCulture), request.Stable, source, request.LotId));
        for (var attempt = 0; ; attempt++)
        {
            // The first attempt may start from this process's last write to the batch; every retry reads the database.
            var remembered = attempt == 0 ? memo.Find(request.BatchId) : null;
            var progress = remembered ?? await store.ProgressAsync(request.BatchId, cancellationToken) ?? throw ApiException.NotFound("batchId", request.BatchId, "batch");
            var (head, additions, corrections) = progress;
            caller.RequireStation(head.StationId, "batchId");
            if (additions.FirstOrDefault(a => a.AdditionId == request.AdditionId) is { } earlier)
            {
                return await ReplayAsync(earlier, contentHash, cancellationToken);
            }

            BatchLedger.RequireInProgress(head.Id, head.Status, "batchId");
            var inForce = await plans.GetAsync(head.Id, head.PlanRevision, cancellationToken);
            var step = inForce.Plan.Steps.FirstOrDefault(s => s.Index == request.StepIndex)
                ?? throw new InvalidInputException("stepIndex", request.StepIndex.ToString(CultureInfo.InvariantCulture),
                    $"the plan has no such step (steps 0 to {inForce.Plan.Steps.Count - 1})");

            var at = time.GetUtcNow();
            var trueMassG = inForce.Basis.TrueMassG(step.Index, request.ReadingG);
            Addition[] soFar = [.. BatchMapping.Effective(additions, corrections)];
            var stepMassG = trueMassG + soFar.Where(a => a.StepIndex == step.Index).Sum(a => a.TrueMassG);
            var addition = new Addition
            {
                AdditionId = request.AdditionId,
                StepIndex = request.StepIndex,
                ReadingG = request.ReadingG,
                Stable = request.Stable,
                Source = source,
                LotId = request.LotId,
                TrueMassG = trueMassG,
                WithinWindow = InWindow(step, stepMassG),
                RecordedAt = Timestamp.FromDateTimeOffset(at),
                PlanRevision = (int)inForce.Revision,
                TargetMassG = step.TargetMassG,
                AcceptanceG = step.AcceptanceG,
                OriginalReadingG = request.ReadingG,
            };
            Addition[] all = [.. soFar, addition];
            var outlook = addition.WithinWindow ? BatchOutlook.Keep(inForce, all) : BatchOutlook.Replan(inForce, all);
            var revision = outlook.Replanned ? inForce.Revision + 1 : inForce.Revision;
            var response = Response(addition, head.Id, inForce.Basis, all, outlook, revision);
            var stored = new AdditionRow
            {
                BatchId = head.Id, AdditionId = request.AdditionId, Ordinal = additions.Count, StepIndex = request.StepIndex,
                ReadingG = request.ReadingG, Stable = request.Stable, Source = source, LotId = request.LotId, TrueMassG = trueMassG,
                WithinWindow = addition.WithinWindow, RecordedAt = TimeText.Format(at), ContentHash = contentHash,
                ResponseBytes = StoredResponse.Deflate(response), PlanRevision = inForce.Revision, TargetMassG = step.TargetMassG, AcceptanceG = step.AcceptanceG,
            };
            var replan = outlook.Replanned
                ? new PlanRevisionRow
                {
                    BatchId = head.Id, Revision = revision, Plan = JsonFormatter.Default.Format(outlook.Plan), ScaleFactor = outlook.ScaleFactor,
                    CauseAdditionId = request.AdditionId, CreatedAt = TimeText.Format(at),
                }
                : null;
            var recorded = new BatchEvent
            {
                BatchId = head.Id, Type = BatchEventType.AdditionRecorded, OccurredAt = addition.RecordedAt, Addition = addition, Status = BatchStatus.InProgress,
            };
            var outcome = await store.TryAppendAdditionAsync(stored, head.Version, replan, JsonFormatter.Default.Format(recorded), at,
                new EventAudit(caller.ActorId, head.StationId), cancellationToken);
            if (outcome.Written)
            {
                memo.RememberAfter(progress, stored, revision);
                signal.Notify(head.Id);
                return response;
            }

            memo.Forget(head.Id);
            if (remembered is null)
            {
                // A concurrent writer won; a remembered progress that lost was only out of date, and is read again at once.
                await ledger.PauseAsync(attempt, cancellationToken);
            }
        }
    }

    public async Task<AsMade> AsMadeAsync(string batchId, CancellationToken cancellationToken)
    {
        var (head, rows, corrections) = await store.ProgressAsync(batchId, cancellationToken) ?? throw ApiException.NotFound("batchId", batchId, "batch");
        Addition[] additions = [.. BatchMapping.Effective(rows, corrections)];
        var basis = await plans.BasisAsync(head.Id, cancellationToken);
        return AsMadeMapping.ToContract(head.Id, basis.AsMade(additions), StepsDone(additions));
    }

    /// <summary>
    /// Whether a step's true mass so far (g) lies within its acceptance band in the plan revision it is judged against;
    /// never for a step a re-plan marked done. The relative slack keeps a reading exactly at the target in window when
    /// the band is zero.
    /// </summary>
    public static bool InWindow(PlanStep step, double stepMassG) =>
        !step.Done && Math.Abs(stepMassG - step.TargetMassG) <= step.AcceptanceG + (1e-9 * step.TargetMassG);

    public static int StepsDone(IEnumerable<Addition> additions) => additions.Select(a => a.StepIndex).Distinct().Count();

    private static RecordAdditionResponse Response(
        Addition addition, string batchId, BatchBasis basis, IReadOnlyList<Addition> all, BatchOutlook outlook, long revision)
    {
        var response = new RecordAdditionResponse
        {
            Addition = addition,
            AsMade = AsMadeMapping.ToContract(batchId, basis.AsMade(all), StepsDone(all)),
            PredictedFinal = CompositionMapping.ToContract(outlook.Predicted),
            Replanned = outlook.Replanned,
            PlanRevision = (int)revision,
            PredictedWithinSpec = outlook.WithinSpec,
            ScaleFactor = outlook.ScaleFactor,
        };
        response.RemainingSteps.AddRange(outlook.RemainingSteps(all));
        response.PredictedDeviations.AddRange(outlook.Deviations.Select(AsMadeMapping.ToContract));
        response.Warnings.AddRange(outlook.Warnings);
        return response;
    }

    private async Task<RecordAdditionResponse> ReplayAsync(AdditionRow earlier, string contentHash, CancellationToken cancellationToken)
    {
        if (earlier.ContentHash != contentHash)
        {
            throw ApiException.AlreadyExists("additionId", earlier.AdditionId,
                "this addition id was already recorded with other content; use a new id for a new addition");
        }

        var (text, bytes) = await store.ResponseAsync(earlier.BatchId, earlier.AdditionId, cancellationToken);
        var response = StoredResponse.Read(text, bytes);
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
