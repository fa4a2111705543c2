using System.Diagnostics;

namespace GelDispense.LoadHarness;

/// <summary>
/// Closed-loop load: N clients each send their next call as soon as the last one answered, until the slice is over
/// or the scenario's request cap is reached (a call running at the deadline completes and counts). The scenarios
/// take turns in short slices, round after round, so a neighbour that loads the machine for a while slows all of
/// them alike and their ratios stay meaningful on a shared machine. Each scenario's clients are made once and keep
/// their connections (and a station its batch in progress) from slice to slice, as real clients would.
/// </summary>
public static class LoadRunner
{
    public static async Task<IReadOnlyList<LoadResult>> RunAsync(IReadOnlyList<Scenario> scenarios, HarnessOptions options, CancellationToken cancellationToken)
    {
        var totals = scenarios.Select(_ => new Slice()).ToArray();
        var slice = options.Duration / options.Rounds;
        var capPerSlice = Math.Max(1, options.MaxRequests / options.Rounds);
        var clients = scenarios.Select(s => Enumerable.Range(0, s.Clients).Select(s.NewClient).ToArray()).ToArray();
        try
        {
            if (options.Warmup > TimeSpan.Zero)
            {
                foreach (var scenarioClients in clients)
                {
                    await MeasureAsync(scenarioClients, options.Warmup, capPerSlice, cancellationToken);
                }
            }

            for (var round = 1; round <= options.Rounds; round++)
            {
                Console.WriteLine($"  round {round} of {options.Rounds} …");
                for (var k = 0; k < scenarios.Count; k++)
                {
                    totals[k].Add(await MeasureAsync(clients[k], slice, capPerSlice, cancellationToken));
                }
            }

            return [.. scenarios.Select((s, k) => totals[k].Result(s))];
        }
        finally
        {
            foreach (var client in clients.SelectMany(c => c))
            {
                client.Dispose();
            }
        }
    }

    private static async Task<Slice> MeasureAsync(ILoadClient[] clients, TimeSpan duration, int maxRequests, CancellationToken cancellationToken)
    {
        var result = new Slice();
        var issued = 0;
        var cpuBefore = Process.GetCurrentProcess().TotalProcessorTime;
        var clock = Stopwatch.StartNew();
        var latencies = await Task.WhenAll(clients.Select(async client =>
        {
            var mine = new List<long>();
            while (clock.Elapsed < duration && Interlocked.Increment(ref issued) <= maxRequests)
            {
                try
                {
                    await client.PrepareAsync(cancellationToken);
                    var start = Stopwatch.GetTimestamp();
                    await client.CallAsync(cancellationToken);
                    mine.Add(Stopwatch.GetTimestamp() - start);
                }
                catch (Exception e) when (e is not OperationCanceledException)
                {
                    result.Fail(e.Message);
                }
            }

            return mine;
        }));
        result.Finish(latencies.SelectMany(l => l), clock.Elapsed, Process.GetCurrentProcess().TotalProcessorTime - cpuBefore);
        return result;
    }

    /// <summary>What one or more slices of a scenario measured, summed.</summary>
    private sealed class Slice
    {
        private readonly List<long> _latencyTicks = [];
        private int _errors;
        private string? _firstError;
        private TimeSpan _elapsed;
        private TimeSpan _cpu;

        public void Fail(string message)
        {
            Interlocked.Increment(ref _errors);
            Interlocked.CompareExchange(ref _firstError, message, null);
        }

        public void Finish(IEnumerable<long> latencyTicks, TimeSpan elapsed, TimeSpan cpu)
        {
            _latencyTicks.AddRange(latencyTicks);
            _elapsed += elapsed;
            _cpu += cpu;
        }

        public void Add(Slice other)
        {
            Finish(other._latencyTicks, other._elapsed, other._cpu);
            _errors += other._errors;
            _firstError ??= other._firstError;
        }

        public LoadResult Result(Scenario scenario)
        {
            long[] sorted = [.. _latencyTicks.Order()];
            return new LoadResult(scenario.Name, scenario.Protocol, scenario.Clients, sorted.Length, _errors, _elapsed, _cpu, sorted, _firstError);
        }
    }
}
