using GelDispense.Contracts.V1;

namespace GelDispense.LoadHarness;

/// <summary>
/// Load harness for the service: starts it in process on loopback, then measures the plan call against the no-op
/// Ping on REST and gRPC in the same run, and (unless --no-additions) the latency of recording additions.
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
            $"{options.Clients} clients, {options.Duration.TotalSeconds:0} s per scenario after {options.Warmup.TotalSeconds:0} s warm-up, " +
            $"at most {options.MaxRequests} requests per scenario; service in process on 127.0.0.1 with SQLite in a temp dir.");
        var workload = DemoWorkload.Load();
        await using var service = await InProcessService.StartAsync();
        using var stop = new CancellationTokenSource();
        Console.CancelKeyPress += (_, e) =>
        {
            e.Cancel = true;
            stop.Cancel();
        };

        var results = new List<LoadResult>();
        async Task Run(string scenario, string protocol, Func<int, ILoadClient> client, int? clients = null)
        {
            Console.WriteLine($"  {scenario} over {protocol} …");
            results.Add(await LoadRunner.RunAsync(scenario, protocol, clients ?? options.Clients, options, client, stop.Token));
        }

        if (options.AdditionsOnly)
        {
            await RunAdditionsAsync(Run, service, workload);
            return Report(results);
        }

        var (rest, grpc, key) = (service.RestAddress, service.GrpcAddress, service.ApiKey);
        await Run(ResultTable.NoOp, "REST", _ => new RestCall(rest, key, "/v1/ping", () => "{}"));
        await Run(ResultTable.PlanRepeated, "REST", _ => new RestCall(rest, key, "/v1/plans", () => workload.PlanJson));
        await Run(ResultTable.PlanComputed, "REST", _ => new RestCall(rest, key, "/v1/plans", () => workload.PlanJsonAt(workload.FreshGelVolumeMl())));
        await Run(ResultTable.NoOp, "gRPC", _ => new GrpcCall(grpc, key,
            (channel, call) => new ProbeService.ProbeServiceClient(channel).PingAsync(new PingRequest(), call).ResponseAsync));
        await Run(ResultTable.PlanRepeated, "gRPC", _ => new GrpcCall(grpc, key,
            (channel, call) => new PlanService.PlanServiceClient(channel).CreatePlanAsync(workload.PlanRequest, call).ResponseAsync));
        await Run(ResultTable.PlanComputed, "gRPC", _ => new GrpcCall(grpc, key,
            (channel, call) => new PlanService.PlanServiceClient(channel).CreatePlanAsync(workload.PlanRequestAt(workload.FreshGelVolumeMl()), call).ResponseAsync));
        if (options.Additions)
        {
            await RunAdditionsAsync(Run, service, workload);
        }

        return Report(results);
    }

    /// <summary>One station weighing alone (the latency a technician sees), then all clients at once on SQLite's single writer.</summary>
    private static async Task RunAdditionsAsync(Func<string, string, Func<int, ILoadClient>, int?, Task> run, InProcessService service, DemoWorkload workload)
    {
        const string scenario = "record addition POST /v1/batches/{id}/additions";
        await run(scenario, "REST", k => new AdditionSequence(service.RestAddress, service.ApiKey, workload.BatchJson, k), 1);
        await run(scenario, "REST", k => new AdditionSequence(service.RestAddress, service.ApiKey, workload.BatchJson, k), null);
    }

    private static int Report(IReadOnlyList<LoadResult> results)
    {
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
}
