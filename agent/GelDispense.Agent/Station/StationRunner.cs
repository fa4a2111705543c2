using System.Threading.Channels;
using GelDispense.Agent.Display;
using GelDispense.Agent.Formats;
using GelDispense.Agent.Journal;
using GelDispense.Agent.Links;
using GelDispense.Agent.Offline;
using GelDispense.Agent.Readings;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Service;
using GelDispense.Agent.Stability;
using GelDispense.Contracts.V1;
using Google.Protobuf;

namespace GelDispense.Agent.Station;

/// <summary>
/// The station's working loop, at the edge where the pure parts meet I/O: balance lines go through the codec and the
/// stability detector into the <see cref="StepMachine"/>; a confirmation is journaled (durable) before it is sent;
/// the service's answer, or, while it is away, the local chemistry, decides the window and re-plans; the display
/// shows it all. Every input arrives through one queue and is handled on one thread, so the batch state needs no
/// locks; sends and replays run in the background and report back through the same queue.
/// </summary>
public sealed partial class StationRunner(
    IBalanceLink link, LineParser parser, StabilitySettings stability, AdditionOutbox outbox, ServiceLink service, IStationDisplay display, RunSettings settings, TimeProvider time)
{
    private readonly Channel<RunnerInput> _inputs = Channel.CreateUnbounded<RunnerInput>(new UnboundedChannelOptions { SingleReader = true });
    private BatchProgress _progress = null!;
    private LocalBatchModel? _model;
    private string? _modelProblem;
    private StepMachine _machine = null!;
    private StabilityVerdict? _verdict;
    private Recording? _recording;
    private bool _keyPressed;
    private bool _quit;
    private bool _flushing;
    private bool _driftNoted;
    private int _pending;
    private double _temperatureC;
    private DateTimeOffset _lastFlushAt = DateTimeOffset.MinValue;
    private CancellationToken _token;

    /// <summary>What the display shows now; read by a simulated technician from another thread.</summary>
    public StationView? CurrentView { get; private set; }

    /// <summary>A key from the technician: Enter confirms in key mode, q stops (pending additions stay journaled).</summary>
    public void PressKey(char key) => _inputs.Writer.TryWrite(new RunnerInput.Key(key));

    public async Task<RunResult> RunAsync(Batch batch, CancellationToken cancellationToken)
    {
        _token = cancellationToken;
        Load(batch);
        link.StatusChanged += OnLinkChanged;
        service.StatusChanged += OnServiceChanged;
        using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        var pump = PumpAsync(stop.Token);
        var ticks = TickAsync(stop.Token);
        try
        {
            link.Start();
            await BeginStepAsync(cancellationToken).ConfigureAwait(false);
            while (!Finished && await _inputs.Reader.WaitToReadAsync(cancellationToken).ConfigureAwait(false))
            {
                while (!Finished && _inputs.Reader.TryRead(out var input))
                {
                    await HandleAsync(input, cancellationToken).ConfigureAwait(false);
                }
            }
        }
        finally
        {
            link.StatusChanged -= OnLinkChanged;
            service.StatusChanged -= OnServiceChanged;
            await stop.CancelAsync().ConfigureAwait(false);
            await Task.WhenAll(pump, ticks).ConfigureAwait(false);
        }

        return await FinishAsync(cancellationToken).ConfigureAwait(false);
    }

    private bool Finished => _quit || (_recording is null && _progress.Current is null);

    private void Load(Batch batch)
    {
        _progress = BatchProgress.From(batch);
        _temperatureC = batch.Recipe is { HasTemperatureC: true } r ? r.TemperatureC : 20;
        var tare = settings.TareCommand is not null && !_progress.Cumulative ? TareMode.BalanceTare : TareMode.Running;
        _machine = new StepMachine(settings.Machine with { Tare = tare });
        outbox.Store.SaveBatch(batch.Id, JsonFormatter.Default.Format(batch));
        try
        {
            _model = LocalBatchModel.Create(batch);
        }
        catch (Exception ex) when (ex is InvalidOperationException or Chemistry.Errors.InvalidInputException)
        {
            _modelProblem = ex.Message;
            display.Note(NoteKind.Warning, $"offline re-planning is unavailable for this batch: {ex.Message}");
        }

        // Additions confirmed in an earlier run that the service has not seen yet still count here.
        foreach (var entry in outbox.Store.ForBatch(batch.Id).Where(e => e.State == JournalState.Pending))
        {
            if (_progress.Additions.All(a => a.AdditionId != entry.AdditionId))
            {
                RecordLocally(_progress.Step(entry.StepIndex), entry);
            }
        }

        _pending = outbox.PendingCount;
        display.Note(NoteKind.Info, $"batch {batch.Id} ({batch.RecipeName}) at station {batch.StationId}: {_progress.OpenSteps} steps to make, " +
            $"{(tare == TareMode.BalanceTare ? "tare between steps" : _progress.Cumulative ? "cumulative readings" : "software tare between steps")}");
    }

    private async Task PumpAsync(CancellationToken cancellationToken)
    {
        var stream = new BalanceReadingStream(link, parser, new StabilityDetector(stability, time));
        try
        {
            await foreach (var e in stream.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                _inputs.Writer.TryWrite(new RunnerInput.Reading(e));
            }
        }
        catch (OperationCanceledException)
        {
            // The run is over.
        }
    }

    private async Task TickAsync(CancellationToken cancellationToken)
    {
        using var timer = new PeriodicTimer(settings.Tick, time);
        try
        {
            while (await timer.WaitForNextTickAsync(cancellationToken).ConfigureAwait(false))
            {
                _inputs.Writer.TryWrite(new RunnerInput.Tick());
            }
        }
        catch (OperationCanceledException)
        {
            // The run is over.
        }
    }

    private void OnLinkChanged(object? sender, LinkStatusChange change) => _inputs.Writer.TryWrite(new RunnerInput.LinkChanged(change));

    private void OnServiceChanged(ServiceStatusChange change) => _inputs.Writer.TryWrite(new RunnerInput.ServiceChanged(change));

    private void Show()
    {
        CurrentView = StationViewBuilder.Build(_progress, _machine, _verdict, link.Status, service.Status, _pending, settings, _temperatureC);
        display.Show(CurrentView);
    }

    /// <summary>A confirmed addition on its way: the journal entry, the step it fulfils and the pan's gross reading.</summary>
    private sealed record Recording(JournalEntry Entry, PlanStep Step, StepWindow Window, double GrossG);
}
