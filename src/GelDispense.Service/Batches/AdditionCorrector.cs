using System.Globalization;
using GelDispense.Contracts.V1;
using GelDispense.Service.Errors;
using GelDispense.Service.Mapping;
using GelDispense.Service.Security;
using GelDispense.Service.Storage;
using Google.Protobuf;
using Google.Protobuf.WellKnownTypes;

namespace GelDispense.Service.Batches;

/// <summary>
/// Corrects the reading of a recorded addition by appending a correction and its event; the addition row and earlier
/// corrections are never touched. The correction id is the idempotency key, as the addition id is for additions, and
/// writers of one batch are serialised by the batch version the same way (a loser reads again).
/// </summary>
/// <remarks>
/// The corrected addition is judged against the plan revision, target and band it was first judged against, with
/// the (corrected) additions before it on the same step. An in-progress batch is re-planned when the corrected
/// addition is out of window or when a re-plan was made after the addition was judged (it used the wrong mass);
/// otherwise the plan in force stands. A completed batch stays completed and only its as-made record changes; an
/// aborted batch refuses corrections.
/// </remarks>
public sealed class AdditionCorrector(BatchLedger ledger, BatchStore store, BatchPlanCache plans, BatchEventSignal signal, TimeProvider time)
{
    public async Task<CorrectAdditionResponse> CorrectAsync(CorrectAdditionRequest request, Caller caller, CancellationToken cancellationToken)
    {
        var reason = CorrectionInput.Validate(request);
        var contentHash = BatchLedger.Hash(string.Join('|', request.AdditionId, request.ReadingG.ToString("R", CultureInfo.InvariantCulture), reason));
        for (var attempt = 0; ; attempt++)
        {
            var (head, additions, corrections) = await store.ProgressAsync(request.BatchId, cancellationToken)
                ?? throw ApiException.NotFound("batchId", request.BatchId, "batch");
            caller.RequireStation(head.StationId, "batchId");
            if (corrections.FirstOrDefault(c => c.CorrectionId == request.CorrectionId) is { } earlier)
            {
                return await ReplayAsync(earlier, contentHash, cancellationToken);
            }

            var row = additions.FirstOrDefault(a => a.AdditionId == request.AdditionId)
                ?? throw ApiException.NotFound("additionId", request.AdditionId, "addition in this batch");
            var status = BatchMapping.Status(head.Status);
            if (status == BatchStatus.Aborted)
            {
                throw ApiException.Conflict("batchId", head.Id, "the batch is aborted; its record is closed and takes no corrections");
            }

            Addition[] all = [.. BatchMapping.Effective(additions, corrections)];
            var index = additions.ToList().IndexOf(row);
            var judgedBy = await plans.GetAsync(head.Id, row.PlanRevision, cancellationToken);
            var step = judgedBy.Plan.Steps.First(s => s.Index == row.StepIndex);
            var trueMassG = judgedBy.Basis.TrueMassG(step.Index, request.ReadingG);
            var stepMassG = trueMassG + all.Take(index).Where(a => a.StepIndex == step.Index).Sum(a => a.TrueMassG);
            var at = time.GetUtcNow();
            var previous = corrections.LastOrDefault(c => c.AdditionId == row.AdditionId);
            var stored = new CorrectionRow
            {
                BatchId = head.Id, CorrectionId = request.CorrectionId, AdditionId = row.AdditionId,
                CorrectsSeq = previous?.Seq ?? await store.AdditionEventSeqAsync(head.Id, row.AdditionId, cancellationToken),
                PreviousReadingG = all[index].ReadingG, ReadingG = request.ReadingG, TrueMassG = trueMassG,
                WithinWindow = AdditionRecorder.InWindow(step, stepMassG), Reason = reason, ActorKeyId = caller.ActorId,
                StationId = head.StationId, RecordedAt = TimeText.Format(at), ContentHash = contentHash,
            };
            all[index] = BatchMapping.Corrected(all[index], [.. corrections.Where(c => c.AdditionId == row.AdditionId), stored]);

            var response = new CorrectAdditionResponse { Correction = all[index].LatestCorrection, Addition = all[index] };
            response.AsMade = AsMadeMapping.ToContract(head.Id, judgedBy.Basis.AsMade(all), AdditionRecorder.StepsDone(all));
            PlanRevisionRow? replan = null;
            if (status == BatchStatus.InProgress)
            {
                var inForce = await plans.GetAsync(head.Id, head.PlanRevision, cancellationToken);
                var outlook = !stored.WithinWindow || head.PlanRevision > row.PlanRevision ? BatchOutlook.Replan(inForce, all) : BatchOutlook.Keep(inForce, all);
                var revision = outlook.Replanned ? inForce.Revision + 1 : inForce.Revision;
                Describe(response, outlook, all, revision);
                replan = outlook.Replanned
                    ? new PlanRevisionRow
                    {
                        BatchId = head.Id, Revision = revision, Plan = JsonFormatter.Default.Format(outlook.Plan), ScaleFactor = outlook.ScaleFactor,
                        CauseAdditionId = row.AdditionId, CreatedAt = TimeText.Format(at),
                    }
                    : null;
            }
            else
            {
                Settled(response, (int)head.PlanRevision);
            }

            var body = JsonFormatter.Default.Format(new BatchEvent
            {
                BatchId = head.Id, Type = BatchEventType.AdditionCorrected, OccurredAt = Timestamp.FromDateTimeOffset(at),
                Addition = all[index], Correction = all[index].LatestCorrection, Status = status,
            });
            var outcome = await store.TryAppendCorrectionAsync(
                stored with { Response = StoredResponse.Write(response) }, head.Version, replan, body, at, cancellationToken);
            if (outcome.Written)
            {
                signal.Notify(head.Id);
                return Stamped(response, outcome.EventSeq);
            }

            await ledger.PauseAsync(attempt, cancellationToken);
        }
    }

    private static void Describe(CorrectAdditionResponse response, BatchOutlook outlook, IReadOnlyList<Addition> all, long revision)
    {
        response.RemainingSteps.AddRange(outlook.RemainingSteps(all));
        response.PredictedFinal = CompositionMapping.ToContract(outlook.Predicted);
        response.Replanned = outlook.Replanned;
        response.PlanRevision = (int)revision;
        response.PredictedWithinSpec = outlook.WithinSpec;
        response.PredictedDeviations.AddRange(outlook.Deviations.Select(AsMadeMapping.ToContract));
        response.Warnings.AddRange(outlook.Warnings);
    }

    /// <summary>A completed batch has nothing left to make: its final composition is the as-made one.</summary>
    private static void Settled(CorrectAdditionResponse response, int revision)
    {
        response.PlanRevision = revision;
        response.PredictedFinal = response.AsMade.Composition;
        response.PredictedWithinSpec = response.AsMade.WithinSpec;
        response.PredictedDeviations.AddRange(response.AsMade.Deviations);
        response.Warnings.Add("The batch is completed: it stays completed and its as-made record now uses the corrected reading.");
    }

    private async Task<CorrectAdditionResponse> ReplayAsync(CorrectionRow earlier, string contentHash, CancellationToken cancellationToken)
    {
        if (earlier.ContentHash != contentHash)
        {
            throw ApiException.AlreadyExists("correctionId", earlier.CorrectionId,
                "this correction id was already recorded with other content; use a new id for a new correction");
        }

        var response = Stamped(StoredResponse.ReadCorrection(await store.CorrectionResponseAsync(earlier.BatchId, earlier.CorrectionId, cancellationToken)), earlier.Seq);
        response.Replayed = true;
        return response;
    }

    /// <summary>The correction's own sequence is known only once its event is written, after the response was stored.</summary>
    private static CorrectAdditionResponse Stamped(CorrectAdditionResponse response, long seq)
    {
        response.Correction.Sequence = seq;
        response.Addition.LatestCorrection.Sequence = seq;
        return response;
    }
}
