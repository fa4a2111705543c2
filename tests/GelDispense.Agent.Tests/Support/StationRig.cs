using GelDispense.Agent.Demo;
using GelDispense.Agent.Formats;
using GelDispense.Agent.Hosting;
using GelDispense.Agent.Service;
using GelDispense.Agent.Simulation;
using GelDispense.Agent.Station;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;

namespace GelDispense.Agent.Tests.Support;

/// <summary>
/// A whole station for loop tests, all real: the service in-process on loopback HTTP/2 with SQLite in a temporary
/// folder, the simulated balance on a pseudo-terminal (behind a <see cref="ControlledPort"/>) with a technician who
/// follows the screen, and a station session (journal, channel, Polly link) with short backoffs.
/// </summary>
internal sealed class StationRig : IAsyncDisposable
{
    public static readonly ServiceLinkSettings QuickLink = new()
    {
        CallDeadline = TimeSpan.FromSeconds(3),
        RetryFirstDelay = TimeSpan.FromMilliseconds(50),
        RetryMaxDelay = TimeSpan.FromMilliseconds(200),
        BreakerOpenFor = TimeSpan.FromMilliseconds(700),
        InitialReconnectBackoff = TimeSpan.FromMilliseconds(100),
        MaxReconnectBackoff = TimeSpan.FromMilliseconds(500),
        ReplayInterval = TimeSpan.FromMilliseconds(400),
    };

    private readonly CancellationTokenSource _stopSimulator = new();
    private Task _simulating = Task.CompletedTask;

    private StationRig(string dir, EmbeddedService service, ControlledPort port, RigDevices devices, string stationKey)
    {
        Dir = dir;
        Service = service;
        Port = port;
        Devices = devices;
        StationKey = stationKey;
    }

    /// <summary>The station's API key, issued by the service as an admin would.</summary>
    public string StationKey { get; }

    public RigDevices Devices { get; }

    public string Dir { get; }

    public string DatabasePath => Path.Combine(Dir, "service", "geldispense.db");

    public string JournalPath => Path.Combine(Dir, "station", "journal.db");

    public EmbeddedService Service { get; private set; }

    public ControlledPort Port { get; }

    public StationRunner? Runner { get; private set; }

    public RecordingDisplay Display { get; } = new();

    public StationSession Session { get; private set; } = null!;

    // alongside wraps the technician, for tests that must act at a known pan mass from the simulator's own thread.
    public static async Task<StationRig> StartAsync(
        string dir, IReadOnlyDictionary<int, double> overPours, TechnicianPace pace, RigDevices? devices = null, int seed = 11, Func<ITechnician, ControlledPort, ITechnician>? alongside = null)
    {
        devices ??= RigDevices.Demo;
        var service = await EmbeddedService.StartAsync(Path.Combine(dir, "service", "geldispense.db"));
        var key = await service.IssueKeyAsync(Roles.Station, DemoScenario.StationId);
        var rig = new StationRig(dir, service, new ControlledPort(new PtySimulatorPort(Path.Combine(dir, "balance-tty"))), devices, key);
        ITechnician technician = new FollowingTechnician(() => rig.Runner?.CurrentView, overPours, pace, TimeSpan.FromMilliseconds(200));
        technician = alongside?.Invoke(technician, rig.Port) ?? technician;
        var simulator = devices.Simulator;
        var host = new SimulatorHost(
            new BalanceSimulator(simulator, technician, new Random(seed)),
            new SampleRenderer(BuiltInFormats.Column, simulator.ReadabilityG, new Random(seed + 1)),
            rig.Port, simulator, TimeProvider.System);
        rig._simulating = host.RunAsync(null, rig._stopSimulator.Token);
        rig.Session = StationSession.Open(DemoScenario.StationConfig(Path.Combine(dir, "balance-tty"), service.Address, key, simulator.ReadabilityG), rig.JournalPath, QuickLink, TimeProvider.System);
        return rig;
    }

    public Task<Batch> StartDemoBatchAsync(CancellationToken cancellationToken) =>
        Session.StartAsync(new BatchStart(DemoScenario.Recipe(), null, Devices.Balance, Devices.Pipette), Display, cancellationToken);

    public Task<RunResult> RunAsync(Batch batch, CancellationToken cancellationToken)
    {
        var settings = new RunSettings
        {
            TareCommand = DemoScenario.TareCommand,
            Lots = DemoScenario.Lots,
            ReadabilityG = Devices.Simulator.ReadabilityG,
            Machine = new() { ZeroBandG = 5 * Devices.Simulator.ReadabilityG },
        };
        return Session.RunAsync(batch, Display, settings, r => Runner = r, cancellationToken);
    }

    /// <summary>Stops the service as a crash would leave it: gone, with its SQLite file as last committed.</summary>
    public Task KillServiceAsync() => Service.DisposeAsync().AsTask();

    /// <summary>Starts a new service on the same file and the same port, so the station's address still holds.</summary>
    public async Task RestartServiceAsync() => Service = await EmbeddedService.StartAsync(DatabasePath, Service.Port);

    /// <summary>The batch as the service now has it, through a channel of the test's own.</summary>
    public async Task<Batch> ServiceBatchAsync(string batchId)
    {
        using var channel = Grpc.Net.Client.GrpcChannel.ForAddress(Service.Address);
        return await new BatchService.BatchServiceClient(channel).GetBatchAsync(new GetBatchRequest { Id = batchId }, new Grpc.Core.Metadata { { "authorization", $"Bearer {StationKey}" } });
    }

    public async Task WaitForAsync(Func<bool> condition, TimeSpan limit, string what)
    {
        var until = DateTimeOffset.UtcNow + limit;
        while (!condition())
        {
            Assert.True(DateTimeOffset.UtcNow < until, $"timed out waiting for {what}\n{Display.Log}");
            await Task.Delay(10);
        }
    }

    public async ValueTask DisposeAsync()
    {
        await _stopSimulator.CancelAsync();
        try
        {
            await _simulating;
        }
        catch (OperationCanceledException)
        {
            // The simulator runs until told to stop.
        }

        await Session.DisposeAsync();
        await Service.DisposeAsync();
        Port.Dispose();
        _stopSimulator.Dispose();
    }
}
