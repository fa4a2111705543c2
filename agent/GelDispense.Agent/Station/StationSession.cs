using GelDispense.Agent.Configuration;
using GelDispense.Agent.Display;
using GelDispense.Agent.Journal;
using GelDispense.Agent.Service;
using GelDispense.Chemistry.Errors;
using GelDispense.Contracts.V1;
using Google.Protobuf;
using Grpc.Core;

namespace GelDispense.Agent.Station;

/// <summary>
/// One station at work: its balance setup, journal, channel and service link. On start it replays whatever the
/// journal still holds for any batch, then starts or resumes a batch and runs it. Resuming works offline from
/// the journal's copy of the batch; starting a new batch needs the service, which assigns its id and plan.
/// </summary>
public sealed class StationSession : IAsyncDisposable
{
    private readonly ServiceConnection _connection;
    private readonly TimeProvider _time;

    private StationSession(StationConfig config, BalanceSetup setup, AdditionJournal journal, ServiceConnection connection, TimeProvider time)
    {
        Config = config;
        Setup = setup;
        Journal = journal;
        _connection = connection;
        Service = connection.Link;
        Outbox = new AdditionOutbox(journal, Service);
        _time = time;
    }

    public StationConfig Config { get; }

    public BalanceSetup Setup { get; }

    public AdditionJournal Journal { get; }

    public ServiceLink Service { get; }

    public AdditionOutbox Outbox { get; }

    /// <summary>Checks the config (every problem at once) and opens the journal and the service connection.</summary>
    public static StationSession Open(StationConfig config, string journalPath, ServiceLinkSettings linkSettings, TimeProvider time)
    {
        var setup = BalanceSetup.From(config);
        var journal = AdditionJournal.Open(journalPath, time);
        return new StationSession(config, setup, journal, ServiceConnection.Open(config, linkSettings, time), time);
    }

    /// <summary>Replays the journal, then creates the batch from the recipe or fetches the one to resume.</summary>
    public async Task<Batch> StartAsync(BatchStart start, IStationDisplay display, CancellationToken cancellationToken)
    {
        var replay = await Outbox.FlushAsync(cancellationToken).ConfigureAwait(false);
        if (replay.Deliveries.Count > 0 || !replay.Complete)
        {
            display.Note(replay.Complete ? NoteKind.Good : NoteKind.Warning,
                $"journal replay on start: {replay.Deliveries.Count} sent, {replay.StillPending} still pending{(replay.Complete ? "" : $" ({replay.StoppedBecause})")}");
        }

        if (start.Recipe is { } recipe)
        {
            var request = new CreateBatchRequest { StationId = Config.StationId, Recipe = recipe, Balance = start.Balance, Pipette = start.Pipette, Air = start.Air, Options = start.Options };
            try
            {
                return await Service.CreateBatchAsync(request, cancellationToken).ConfigureAwait(false);
            }
            catch (Exception ex) when (ServiceFaults.IsUnreachable(ex))
            {
                throw new InvalidInputException("serviceAddress", Config.ServiceAddress,
                    $"a new batch needs the service, which cannot be reached ({ServiceFaults.Describe(ex)}); a batch already started can be resumed offline with --batch");
            }
            catch (RpcException ex)
            {
                throw Refused(ex, "--recipe", recipe.Name);
            }
        }

        var id = start.BatchId!;
        try
        {
            return await Service.GetBatchAsync(id, cancellationToken).ConfigureAwait(false);
        }
        catch (Exception ex) when (ServiceFaults.IsUnreachable(ex) && Journal.LoadBatch(id) is { } saved)
        {
            display.Note(NoteKind.Warning, $"service unreachable ({ServiceFaults.Describe(ex)}): resuming batch {id} from the journal's copy");
            return JsonParser.Default.Parse<Batch>(saved);
        }
        catch (RpcException ex) when (!ServiceFaults.IsUnreachable(ex))
        {
            throw Refused(ex, "--batch", id);
        }
    }

    /// <summary>Runs the batch at the balance until every step is made (or the technician stops).</summary>
    public async Task<RunResult> RunAsync(Batch batch, IStationDisplay display, RunSettings settings, Action<StationRunner>? started, CancellationToken cancellationToken)
    {
        await using var link = Setup.CreateLink(_time);
        var runner = new StationRunner(link, Setup.Parser, Setup.Stability, Outbox, Service, display, settings, _time);
        started?.Invoke(runner);
        return await runner.RunAsync(batch, cancellationToken).ConfigureAwait(false);
    }

    /// <summary>The service's refusal as a field error the command line can print: the key, or what was asked for.</summary>
    private InvalidInputException Refused(RpcException ex, string field, string value) => ServiceFaults.IsAccessRefused(ex)
        ? new InvalidInputException("apiKey", Config.ApiKey is null ? "(none)" : "(given)", $"the service refuses this station's key: {ServiceFaults.Describe(ex)}")
        : new InvalidInputException(field, value, $"the service refused it: {ServiceFaults.Describe(ex)}");

    public ValueTask DisposeAsync()
    {
        _connection.Dispose();
        Journal.Dispose();
        return ValueTask.CompletedTask;
    }
}
