using System.Diagnostics;

namespace GelDispense.LoadHarness;

/// <summary>
/// Closed-loop load: N clients each send their next call as soon as the last one answered, until the duration is up
/// or the scenario's request cap is reached (a call running at the deadline completes and counts).
/// </summary>
public static class LoadRunner
{
    public static async Task<LoadResult> RunAsync(
        string scenario, string protocol, int clientCount, HarnessOptions options, Func<int, ILoadClient> newClient, CancellationToken cancellationToken)
    {
        var clients = Enumerable.Range(0, clientCount).Select(newClient).ToArray();
        try
        {
            if (options.Warmup > TimeSpan.Zero)
            {
                await MeasureAsync(clients, options.Warmup, options.MaxRequests, cancellationToken);
            }

            var cpuBefore = Process.GetCurrentProcess().TotalProcessorTime;
            var (latencies, errors, firstError, elapsed) = await MeasureAsync(clients, options.Duration, options.MaxRequests, cancellationToken);
            var cpu = Process.GetCurrentProcess().TotalProcessorTime - cpuBefore;
            var sorted = latencies.SelectMany(l => l).Order().ToArray();
            return new LoadResult(scenario, protocol, clientCount, sorted.Length, errors, elapsed, cpu, sorted, firstError);
        }
        finally
        {
            foreach (var client in clients)
            {
                client.Dispose();
            }
        }
    }

    private static async Task<(List<long>[] Latencies, int Errors, string? FirstError, TimeSpan Elapsed)> MeasureAsync(
        ILoadClient[] clients, TimeSpan duration, int maxRequests, CancellationToken cancellationToken)
    {
        var latencies = clients.Select(_ => new List<long>()).ToArray();
        var issued = 0;
        var errors = 0;
        string? firstError = null;
        var clock = Stopwatch.StartNew();
        await Task.WhenAll(clients.Select(async (client, k) =>
        {
            while (clock.Elapsed < duration && Interlocked.Increment(ref issued) <= maxRequests)
            {
                try
                {
                    await client.PrepareAsync(cancellationToken);
                    var start = Stopwatch.GetTimestamp();
                    await client.CallAsync(cancellationToken);
                    latencies[k].Add(Stopwatch.GetTimestamp() - start);
                }
                catch (Exception e) when (e is not OperationCanceledException)
                {
                    Interlocked.Increment(ref errors);
                    Interlocked.CompareExchange(ref firstError, e.Message, null);
                }
            }
        }));
        return (latencies, errors, firstError, clock.Elapsed);
    }
}
