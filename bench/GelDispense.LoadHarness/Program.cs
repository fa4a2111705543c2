using System.Runtime.InteropServices;
using GelDispense.Contracts.V1;
using GelDispense.Service.Tests.Infrastructure;
using GelDispense.Service.Storage;
using Google.Protobuf.Reflection;

namespace GelDispense.LoadHarness;

/// <summary>
/// Load harness for the service: starts it in process on loopback, then measures the plan call against the no-op
/// Ping on REST and gRPC in the same run, and (unless --no-additions) the latency of recording additions; or, with
/// --ingest, addition ingest from many stations on PostgreSQL against a raw insert loop.
/// </summary>
public static class Program
{
    public static async Task<int> Main(string[] args)
    {
        HarnessOptions options;
        try
        {
            options = HarnessOptions.Parse(args);
        }
        catch (ArgumentException e)
        {
            await Console.Error.WriteLineAsync(e.Message);
            return 2;
        }

#if DEBUG
        Console.WriteLine("WARNING: Debug build; run with -c Release for figures worth quoting.");
#endif
        Console.WriteLine($"GelDispense load harness: .NET {Environment.Version}, {Environment.ProcessorCount} logical cores, " +
            $"{(options.Ingest ? $"{options.Stations} stations" : $"{options.Clients} clients")}, {options.Duration.TotalSeconds:0} s per scenario in {options.Rounds} interleaved rounds after " +
            $"warm-up passes of {options.Warmup.TotalSeconds:0} s per scenario until the JIT settles (at most {options.MaxWarmup.TotalSeconds:0} s), at most {options.MaxRequests} requests per scenario; service in process on 127.0.0.1 " +
            $"with {(options.Ingest ? "PostgreSQL" : "SQLite in a temp dir")}; load average before: {LoadAverage()}.");
        var workload = DemoWorkload.Load();
        try
        {
            return options.Ingest ? await IngestAsync(options, workload) : await PlansAsync(options, workload);
        }
        catch (OperationCanceledException) when (RunStop.Signalled)
        {
            // The using blocks have run by now: the service is stopped and a throwaway cluster and the temp files deleted.
            await Console.Error.WriteLineAsync("stopped by Ctrl+C or SIGTERM before the run ended: no figures.");
            return 130;
        }
    }

    /// <summary>The service on SQLite: plans against the no-op on REST and gRPC, and the latency of recording additions.</summary>
    private static async Task<int> PlansAsync(HarnessOptions options, DemoWorkload workload)
    {
        await using var service = await InProcessService.StartAsync();
        using var stop = new RunStop();

        var (rest, grpc, key) = (service.RestAddress, service.GrpcAddress, service.ApiKey);
        var scenarios = new List<Scenario>();
        if (!options.AdditionsOnly)
        {
            scenarios.AddRange(
            [
                new(ResultTable.NoOp, "REST", options.Clients, _ => new RestCall(rest, key, "/v1/ping", () => "{}")),
                new(ResultTable.PlanRepeated, "REST", options.Clients, _ => new RestCall(rest, key, "/v1/plans", () => workload.PlanJson)),
                new(ResultTable.PlanComputed, "REST", options.Clients,
                    _ => new RestCall(rest, key, "/v1/plans", () => workload.PlanJsonAt(workload.FreshGelVolumeMl()))),
                new(ResultTable.NoOp, "gRPC", options.Clients, _ => new GrpcCall(grpc, key, Method(ProbeService.Descriptor, "Ping"), () => new PingRequest())),
                new(ResultTable.PlanRepeated, "gRPC", options.Clients, _ => new GrpcCall(grpc, key, Method(PlanService.Descriptor, "CreatePlan"), () => workload.PlanRequest)),
                new(ResultTable.PlanComputed, "gRPC", options.Clients, _ => new GrpcCall(grpc, key, Method(PlanService.Descriptor, "CreatePlan"),
                    () => workload.PlanRequestAt(workload.FreshGelVolumeMl()))),
            ]);
        }

        if (options.Additions)
        {
            // One station weighing alone (the latency a technician sees), then every client at once on SQLite's single writer.
            const string addition = "record addition POST /v1/batches/{id}/additions";
            scenarios.Add(new(addition, "REST", 1, k => new AdditionSequence(rest, key, workload.BatchJson, k)));
            scenarios.Add(new(addition, "REST", options.Clients, k => new AdditionSequence(rest, key, workload.BatchJson, k)));
        }

        return await RunAsync(scenarios, options, stop.Token);
    }

    /// <summary>The service on PostgreSQL (a throwaway cluster unless --postgres names one), stations against raw inserts.</summary>
    private static async Task<int> IngestAsync(HarnessOptions options, DemoWorkload workload)
    {
        // First, so that a signal while the cluster starts still ends in its cleanup.
        using var stop = new RunStop();
        // The cluster allows 200 connections: the service's pool, one per raw loop and the storage-write baseline's pool.
        await using var cluster = options.Postgres is null ? await LocalPostgres.StartAsync() : null;
        var connectionString = options.Postgres ?? cluster!.ConnectionString;
        await using var service = await InProcessService.StartAsync(connectionString);
        // The storage-write baseline's own pool, with the service's settings (PostgresDatabase.WithPoolDefaults).
        await using var database = new PostgresDatabase(connectionString, TimeProvider.System);
        var scenarios = await IngestScenarios.CreateAsync(service, connectionString, new BatchStore(database), workload, options.Stations);
        return await RunAsync(scenarios, options, stop.Token);
    }

    /// <summary>Runs the scenarios (with --only, those whose name or protocol holds its text) and reports them.</summary>
    private static async Task<int> RunAsync(IReadOnlyList<Scenario> scenarios, HarnessOptions options, CancellationToken cancellationToken)
    {
        IReadOnlyList<Scenario> chosen = options.Only is not { } only
            ? scenarios
            : [.. scenarios.Where(s => s.Name.Contains(only, StringComparison.OrdinalIgnoreCase) || s.Protocol.Contains(only, StringComparison.OrdinalIgnoreCase))];
        if (chosen.Count == 0)
        {
            await Console.Error.WriteLineAsync($"--only '{options.Only}': no scenario's name or protocol holds it; they are: " +
                string.Join("; ", scenarios.Select(s => $"{s.Name} ({s.Protocol})")));
            return 2;
        }

        return Report(await LoadRunner.RunAsync(chosen, options, cancellationToken));
    }

    private static MethodDescriptor Method(ServiceDescriptor service, string name) =>
        service.FindMethodByName(name) ?? throw new InvalidOperationException($"{service.FullName} has no method {name}.");

    /// <summary>
    /// Ctrl+C or SIGTERM (from <c>timeout</c> or a CI runner) ends the run early, and the service, a throwaway cluster
    /// and the temporary files are still cleaned up. Without SIGTERM here the in-process service's host would take
    /// the signal alone, stop the service and leave the harness measuring errors.
    /// </summary>
    private sealed class RunStop : IDisposable
    {
        private static volatile bool _signalled;
        private readonly CancellationTokenSource _stop = new();
        private readonly PosixSignalRegistration[] _signals;

        public RunStop() => _signals = [PosixSignalRegistration.Create(PosixSignal.SIGINT, Stop), PosixSignalRegistration.Create(PosixSignal.SIGTERM, Stop)];

        /// <summary>Whether a signal asked the run to stop.</summary>
        public static bool Signalled => _signalled;

        public CancellationToken Token => _stop.Token;

        public void Dispose()
        {
            foreach (var signal in _signals)
            {
                signal.Dispose();
            }

            _stop.Dispose();
        }

        private void Stop(PosixSignalContext context)
        {
            context.Cancel = true;
            _signalled = true;
            _stop.Cancel();
        }
    }

    private static int Report(IReadOnlyList<LoadResult> results)
    {
        Console.WriteLine($"load average after: {LoadAverage()}");
        Console.WriteLine();
        Console.Write(ResultTable.Format(results));
        foreach (var verdict in ResultTable.Verdicts(results))
        {
            Console.WriteLine(verdict);
        }

        foreach (var failed in results.Where(r => r.Errors > 0))
        {
            Console.WriteLine($"{failed.Scenario} over {failed.Protocol}: {failed.Errors} errors, first: {failed.FirstError}");
        }

        return results.Any(r => r.Errors > 0) ? 1 : 0;
    }

    /// <summary>The 1, 5 and 15 minute load averages on Linux, so a reader can tell how busy the machine was.</summary>
    private static string LoadAverage() =>
        File.Exists("/proc/loadavg") ? string.Join(' ', File.ReadAllText("/proc/loadavg").Split(' ').Take(3)) : "unknown";
}
