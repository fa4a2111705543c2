using GelDispense.Agent.Display;
using GelDispense.Agent.Journal;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Service;
using GelDispense.Contracts.V1;
using Google.Protobuf;

namespace GelDispense.Agent.Station;

/// <summary>The outcome half of <see cref="StationRunner"/>: the service's answer or the local one, replays, the end.</summary>
public sealed partial class StationRunner
{
    private async Task OnRecordedAsync(RunnerInput.Recorded recorded, CancellationToken cancellationToken)
    {
        _flushing = false;
        var (entry, report, fresh) = (recorded.Entry, recorded.Report, recorded.Fresh);
        var recording = _recording!;
        _recording = null;
        Acknowledge(report, entry.AdditionId);
        var before = _progress.Steps.ToDictionary(s => s.Index);
        switch (report.For(entry.AdditionId))
        {
            case { Response: { } response }:
                _progress.Record(new MadeAddition(entry.AdditionId, entry.StepIndex, entry.ReadingG, response.Addition.TrueMassG, response.Addition.WithinWindow, true),
                    response.RemainingSteps, response.PlanRevision);
                NoteOutcome(recording.Step, response.Addition.TrueMassG, response.Addition.WithinWindow, "the service");
                if (response.Replanned)
                {
                    NoteReplan(before, response.RemainingSteps, response.PredictedFinal, response.PredictedWithinSpec, response.ScaleFactor, response.Warnings);
                }

                break;
            case { RefusedBecause: { } why }:
                display.Note(NoteKind.Alert, $"the service refused the addition ({why}); it stays in the journal, marked rejected");
                RecordLocally(recording.Step, entry);
                break;
            default:
                display.Note(NoteKind.Warning, $"not sent ({report.StoppedBecause}): the addition waits in the journal; working offline");
                RecordLocally(recording.Step, entry);
                break;
        }

        if (fresh is not null && _pending == 0)
        {
            Adopt(fresh);
        }

        _machine.Recorded(recording.GrossG);
        await BeginStepAsync(cancellationToken).ConfigureAwait(false);
    }

    private void OnFlushed(FlushReport report, Batch? fresh)
    {
        _flushing = false;
        Acknowledge(report, null);
        var already = report.Deliveries.Count(d => d.Response?.Replayed == true);
        if (report.Deliveries.Count > 0)
        {
            display.Note(NoteKind.Good, $"replayed {report.Deliveries.Count} journaled addition(s) to the service ({already} already recorded there); {_pending} still pending");
        }

        if (fresh is not null && _pending == 0)
        {
            Adopt(fresh);
        }
    }

    private void Acknowledge(FlushReport report, string? ownId)
    {
        foreach (var delivery in report.Deliveries)
        {
            _progress.Acknowledge(delivery.Entry.AdditionId);
            if (delivery.RefusedBecause is { } why && delivery.Entry.AdditionId != ownId)
            {
                display.Note(NoteKind.Alert, $"the service refused journaled addition {delivery.Entry.AdditionId} ({why}); it stays in the journal, marked rejected");
            }
        }

        _pending = outbox.PendingCount;
    }

    /// <summary>Judges an addition with the local chemistry and re-plans around it when it is out of window.</summary>
    private void RecordLocally(PlanStep step, JournalEntry entry)
    {
        var before = _progress.Steps.ToDictionary(s => s.Index);
        if (_model is null)
        {
            var window = StepWindow.For(step);
            var inside = window.Position(entry.ReadingG) == WindowPosition.Inside;
            _progress.Record(new MadeAddition(entry.AdditionId, step.Index, entry.ReadingG, window.TrueMassG(entry.ReadingG), inside, false), [], _progress.PlanRevision);
            NoteOutcome(step, window.TrueMassG(entry.ReadingG), inside, "the station");
            if (!inside)
            {
                display.Note(NoteKind.Alert, $"cannot re-plan at the station ({_modelProblem}); the remaining targets stand until the service is back");
            }

            return;
        }

        var outcome = _model.Judge(step, entry.ReadingG, _progress.Additions, entry.AdditionId);
        _progress.Record(new MadeAddition(entry.AdditionId, step.Index, entry.ReadingG, outcome.TrueMassG, outcome.WithinWindow, false), outcome.RemainingSteps, _progress.PlanRevision);
        NoteOutcome(step, outcome.TrueMassG, outcome.WithinWindow, "the station (offline)");
        if (!outcome.WithinWindow)
        {
            NoteReplan(before, outcome.RemainingSteps, outcome.PredictedFinal, null, null, outcome.Warnings);
        }
    }

    private void NoteOutcome(PlanStep step, double trueMassG, bool within, string judge)
    {
        var mass = Display.Grams.Number(trueMassG, "0.0000");
        display.Note(within ? NoteKind.Good : NoteKind.Alert, within
            ? $"step {step.Index + 1} {step.ReagentId}: true mass {mass} g, within window (judged by {judge})"
            : $"step {step.Index + 1} {step.ReagentId}: true mass {mass} g is OUT OF WINDOW (target {Display.Grams.Number(step.TargetMassG, "0.0000")} g, judged by {judge}); it is recorded as made");
    }

    private void NoteReplan(IReadOnlyDictionary<int, PlanStep> before, IEnumerable<PlanStep> after, Composition? predicted, bool? withinSpec, double? scaleFactor, IEnumerable<string> warnings)
    {
        display.Note(NoteKind.Warning, "RE-PLANNED: new targets for the remaining steps:");
        foreach (var line in OutcomeText.Replanned(before, after, settings.ReadabilityG))
        {
            display.Note(NoteKind.Warning, line);
        }

        display.Note(NoteKind.Info, OutcomeText.Predicted(predicted, withinSpec, scaleFactor));
        foreach (var warning in warnings)
        {
            display.Note(NoteKind.Warning, warning);
        }
    }

    /// <summary>Takes the service's copy of the batch after a replay: its re-plans replace the ones made here.</summary>
    private void Adopt(Batch fresh)
    {
        var before = _progress.Current;
        _progress.Adopt(fresh);
        outbox.Store.SaveBatch(fresh.Id, JsonFormatter.Default.Format(fresh));
        if (before is not null && _progress.Current is { } now && now.Index == before.Index && now.TargetReadingG != before.TargetReadingG)
        {
            _machine.Retarget(StepWindow.For(now));
            display.Note(NoteKind.Warning, $"the service re-planned after the replay: step {now.Index + 1} {now.ReagentId} now {Display.Grams.Text(now.TargetReadingG, settings.ReadabilityG)}");
        }
    }

    private async Task<RunResult> FinishAsync(CancellationToken cancellationToken)
    {
        if (_quit)
        {
            display.Note(NoteKind.Warning, $"stopped by the technician; {_pending} addition(s) wait in the journal");
            return new RunResult(_progress.BatchId, false, false, _pending, null, _progress.Additions);
        }

        if (_pending > 0)
        {
            var report = await outbox.FlushAsync(cancellationToken).ConfigureAwait(false);
            Acknowledge(report, null);
        }

        if (_pending == 0)
        {
            try
            {
                var asMade = await service.GetAsMadeAsync(_progress.BatchId, cancellationToken).ConfigureAwait(false);
                var completed = settings.CompleteAtEnd && (await service.CompleteBatchAsync(_progress.BatchId, cancellationToken).ConfigureAwait(false)).Status == BatchStatus.Completed;
                display.Note(NoteKind.Good, completed ? "every addition is recorded at the service; batch completed" : "every addition is recorded at the service");
                display.Finish(asMade, _progress.RecipeName, "recorded by the service");
                return new RunResult(_progress.BatchId, true, completed, 0, asMade, _progress.Additions);
            }
            catch (Exception ex) when (ServiceFaults.IsUnreachable(ex) || ex is Grpc.Core.RpcException)
            {
                display.Note(NoteKind.Warning, $"the service did not give the as-made record at the end ({ServiceFaults.Describe(ex)})");
            }
        }

        var local = _model?.AsMade(_progress.BatchId, _progress.Additions);
        display.Note(NoteKind.Warning, $"{_pending} addition(s) wait in the journal; run again with --batch {_progress.BatchId} when the service is back to send them");
        if (local is not null)
        {
            display.Finish(local, _progress.RecipeName, "computed at the station, not yet confirmed by the service");
        }

        return new RunResult(_progress.BatchId, true, false, _pending, local, _progress.Additions);
    }
}
