using GelDispense.Agent.Display;
using GelDispense.Agent.Journal;
using GelDispense.Agent.Links;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Service;
using GelDispense.Contracts.V1;
using Microsoft.Data.Sqlite;

namespace GelDispense.Agent.Station;

/// <summary>The step-by-step half of <see cref="StationRunner"/>: reacting to inputs, confirming, recording outcomes.</summary>
public sealed partial class StationRunner
{
    private async Task HandleAsync(RunnerInput input, CancellationToken cancellationToken)
    {
        var now = time.GetUtcNow();
        switch (input)
        {
            case RunnerInput.Reading { Event.Verdict: { } verdict }:
                _verdict = verdict;
                NoteDrift(verdict);
                await ExecuteAsync(_machine.OnReading(verdict, link.Status == LinkStatus.Connected, TakeKey(), now), cancellationToken).ConfigureAwait(false);
                break;
            case RunnerInput.LinkChanged { Change: var change }:
                // A reading from before a hang-up says nothing about the pan now.
                _verdict = change.Status == LinkStatus.Connected ? _verdict : null;
                display.Note(change.Status == LinkStatus.Connected ? NoteKind.Good : NoteKind.Warning, $"balance {change}");
                if (change.Status == LinkStatus.Connected)
                {
                    await ExecuteAsync(_machine.OnLinkUp(now), cancellationToken).ConfigureAwait(false);
                }

                break;
            case RunnerInput.ServiceChanged { Change: var change }:
                display.Note(change.Status == ServiceStatus.Online ? NoteKind.Good : NoteKind.Warning,
                    change.Status == ServiceStatus.Offline ? $"service OFFLINE ({change.Reason}): confirming and re-planning at the station" : $"service {change}");
                break;
            case RunnerInput.Key { Char: '\r' or '\n' or ' ' }:
                _keyPressed = true;
                await ExecuteAsync(_machine.OnReading(_verdict, link.Status == LinkStatus.Connected, TakeKey(), now), cancellationToken).ConfigureAwait(false);
                break;
            case RunnerInput.Key { Char: 'q' or 'Q' }:
                _quit = true;
                break;
            case RunnerInput.Recorded recorded:
                await OnRecordedAsync(recorded, cancellationToken).ConfigureAwait(false);
                break;
            case RunnerInput.Flushed flushed:
                OnFlushed(flushed.Report, flushed.Fresh);
                break;
            case RunnerInput.Tick:
                await ExecuteAsync(_machine.OnTick(now), cancellationToken).ConfigureAwait(false);
                ReplayIfDue(now);
                break;
        }

        Show();
    }

    private bool TakeKey()
    {
        var pressed = _keyPressed;
        _keyPressed = false;
        return pressed;
    }

    private void NoteDrift(Stability.StabilityVerdict verdict)
    {
        if (verdict.Drifting && !_driftNoted && _machine.Window is not null)
        {
            _driftNoted = true;
            display.Note(NoteKind.Warning, Display.Grams.Signed(verdict.Drift!.SlopeGPerMin * 1000, 1) +
                " mg/min drift on the balance: evaporation? Cover the vessel and confirm promptly.");
        }
    }

    private async Task BeginStepAsync(CancellationToken cancellationToken)
    {
        if (_progress.Current is not { } step)
        {
            return;
        }

        var window = StepWindow.For(step);
        var counted = _progress.Steps.Where(s => s.TargetMassG > 0).Select(s => s.Index).ToList();
        display.Note(NoteKind.Info, OutcomeText.StepStart(step, window, counted.IndexOf(step.Index) + 1, counted.Count, settings.LotOf(step.ReagentId), settings.ReadabilityG));
        foreach (var caution in step.Cautions)
        {
            display.Note(NoteKind.Warning, $"{step.ReagentId}: {caution}");
        }

        _driftNoted = false;
        await ExecuteAsync(_machine.Begin(window, time.GetUtcNow()), cancellationToken).ConfigureAwait(false);
    }

    private async Task ExecuteAsync(MachineAction action, CancellationToken cancellationToken)
    {
        switch (action.Kind)
        {
            case MachineActionKind.SendTare when !await link.SendAsync(settings.TareCommand!, cancellationToken).ConfigureAwait(false) && link.Status != LinkStatus.Connecting:
                display.Note(NoteKind.Warning, "could not send the tare command (balance link down); it is sent again when the link is back");
                break;
            case MachineActionKind.Confirm:
                Confirm(action.Decision!, action.GrossG);
                break;
        }
    }

    private void Confirm(ConfirmDecision decision, double grossG)
    {
        var window = _machine.Window!;
        var step = _progress.Step(window.StepIndex);
        var addition = new NewAddition(Guid.CreateVersion7(time.GetUtcNow()), _progress.BatchId, step.Index, decision.NetReadingG!.Value, settings.Source, settings.LotOf(step.ReagentId));
        JournalEntry entry;
        try
        {
            entry = outbox.Journal(addition);
        }
        catch (Exception ex) when (ex is SqliteException or IOException or UnauthorizedAccessException)
        {
            // Nothing unjournaled is ever sent: the step stays open until the journal can take it.
            _machine.ConfirmationFailed($"could not journal the addition: {ex.Message}");
            display.Note(NoteKind.Alert, $"the journal refused the confirmation ({ex.Message}); fix the disk, the reading will be confirmed again");
            return;
        }

        _pending++;
        _recording = new Recording(entry, step, window, grossG);
        display.Note(decision.Position == WindowPosition.Inside ? NoteKind.Good : NoteKind.Warning, OutcomeText.Confirmed(step, window, decision, settings.ReadabilityG));
        StartFlush(entry);
    }

    private void ReplayIfDue(DateTimeOffset now)
    {
        if (!_flushing && _recording is null && _pending > 0 && now - _lastFlushAt >= service.Settings.ReplayInterval)
        {
            StartFlush(null);
        }
    }

    /// <summary>Sends what is pending in the background; an addition just confirmed goes with it, last in order.</summary>
    private void StartFlush(JournalEntry? entry)
    {
        var cancellationToken = _token;
        _flushing = true;
        _lastFlushAt = time.GetUtcNow();
        _ = Task.Run(async () =>
        {
            FlushReport report;
            try
            {
                report = await outbox.FlushAsync(cancellationToken).ConfigureAwait(false);
            }
            catch (OperationCanceledException)
            {
                return;
            }

            var replayed = report.Deliveries.Count(d => d.Entry.AdditionId != entry?.AdditionId);
            var fresh = report.Complete && replayed > 0 ? await TryGetBatchAsync(cancellationToken).ConfigureAwait(false) : null;
            _inputs.Writer.TryWrite(entry is null ? new RunnerInput.Flushed(report, fresh) : new RunnerInput.Recorded(entry, report, fresh));
        }, CancellationToken.None);
    }

    private async Task<Batch?> TryGetBatchAsync(CancellationToken cancellationToken)
    {
        try
        {
            return await service.GetBatchAsync(_progress.BatchId, cancellationToken).ConfigureAwait(false);
        }
        catch (Exception ex) when (ex is Grpc.Core.RpcException or Polly.CircuitBreaker.BrokenCircuitException)
        {
            return null;
        }
    }
}
