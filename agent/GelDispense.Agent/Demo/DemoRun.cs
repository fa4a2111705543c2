using GelDispense.Agent.Display;
using GelDispense.Agent.Formats;
using GelDispense.Agent.Hosting;
using GelDispense.Agent.Service;
using GelDispense.Agent.Simulation;
using GelDispense.Agent.Station;
using GelDispense.Service.Security;

namespace GelDispense.Agent.Demo;

/// <summary>
/// The whole station on one machine with nothing else running: the service in this process on a free loopback
/// port with SQLite in a temporary directory, the simulated balance on a pseudo-terminal with a technician who
/// follows the screen, and the agent's loop against both. Everything is removed at the end.
/// </summary>
public static class DemoRun
{
    /// <summary>Runs the demo batch to its end and says how it ended.</summary>
    public static async Task<RunResult> RunAsync(IStationDisplay display, TextWriter output, int seed, CancellationToken cancellationToken)
    {
        var time = TimeProvider.System;
        var directory = Directory.CreateTempSubdirectory("geldispense-demo-");
        try
        {
            await using var service = await EmbeddedService.StartAsync(Path.Combine(directory.FullName, "service", "geldispense.db"), 0, "Error", cancellationToken).ConfigureAwait(false);
            display.Note(NoteKind.Info, $"service started in-process at {service.Address} (SQLite in {directory.FullName})");
            var balancePath = Path.Combine(directory.FullName, "balance-tty");
            using var port = new PtySimulatorPort(balancePath);
            StationRunner? runner = null;
            var technician = new FollowingTechnician(() => runner?.CurrentView, DemoScenario.OverPours, DemoScenario.Pace, DemoScenario.Reaction);
            var simulator = DemoScenario.Simulator;
            var host = new SimulatorHost(
                new BalanceSimulator(simulator, technician, new Random(seed)),
                new SampleRenderer(BuiltInFormats.Column, simulator.ReadabilityG, new Random(seed + 1)),
                port, simulator, time);
            var stationKey = await service.IssueKeyAsync(Roles.Station, DemoScenario.StationId, cancellationToken).ConfigureAwait(false);
            using var stopSimulator = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
            var simulating = host.RunAsync(null, stopSimulator.Token);
            display.Note(NoteKind.Info, $"simulated balance (column format, d = 1 mg) on {port.Describe}; technician over-pours step 1 by 3 %");
            try
            {
                await using var session = StationSession.Open(DemoScenario.StationConfig(balancePath, service.Address, stationKey), Path.Combine(directory.FullName, "station", "journal.db"), new ServiceLinkSettings(), time);
                var start = new BatchStart(DemoScenario.Recipe(), null, DemoScenario.Balance, DemoScenario.Pipette);
                var batch = await session.StartAsync(start, display, cancellationToken).ConfigureAwait(false);
                var settings = new RunSettings { TareCommand = DemoScenario.TareCommand, Lots = DemoScenario.Lots, ReadabilityG = DemoScenario.Simulator.ReadabilityG };
                return await session.RunAsync(batch, display, settings, r => runner = r, cancellationToken).ConfigureAwait(false);
            }
            finally
            {
                await stopSimulator.CancelAsync().ConfigureAwait(false);
                await IgnoreCancellation(simulating).ConfigureAwait(false);
            }
        }
        finally
        {
            TryDelete(directory, output);
        }
    }

    private static async Task IgnoreCancellation(Task task)
    {
        try
        {
            await task.ConfigureAwait(false);
        }
        catch (OperationCanceledException)
        {
            // The simulator runs until it is told to stop.
        }
    }

    private static void TryDelete(DirectoryInfo directory, TextWriter output)
    {
        try
        {
            directory.Delete(recursive: true);
        }
        catch (IOException ex)
        {
            output.WriteLine($"note: could not remove {directory.FullName}: {ex.Message}");
        }
    }
}
