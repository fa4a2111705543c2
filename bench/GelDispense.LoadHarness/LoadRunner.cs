using System.Diagnostics;
using System.Runtime;

namespace GelDispense.LoadHarness;

/// <summary>
/// Closed-loop load: N clients each send their next call as soon as the last one answered, until the slice is over
/// or the scenario's request cap is reached (a call running at the deadline completes and counts). The scenarios
/// take turns in short slices, round after round, so a neighbour that loads the machine for a while slows all of
/// them alike and their ratios stay meaningful on a shared machine. Each scenario's clients are made once and keep
/// their connections (and a station its batch in progress) from slice to slice, as real clients would.
/// </summary>
/// <remarks>
/// The figures are meant for a service that has run for a while. On two busy cores tiered compilation takes a
/// minute or more to bring a call path to its final code (measured: after 1 s of warm-up the JIT was still compiling
/// about 400 methods a second through the whole ingest run, and an addition cost twice the CPU it costs later), so
/// warm-up passes over every scenario repeat until one compiles fewer than <see cref="SettledMethodsPerSecond"/>.
/// </remarks>
public static class LoadRunner
{
    /// <summary>A warm-up pass that compiles fewer methods than this per second means the JIT has settled.</summary>
    public const double SettledMethodsPerSecond = 5;

    public static async Task<IReadOnlyList<LoadResult>> RunAsync(IReadOnlyList<Scenario> scenarios, HarnessOptions options, CancellationToken cancellationToken)
    {
        var totals = scenarios.Select(_ => new Slice()).ToArray();
        var slice = options.Duration / options.Rounds;
        var capPerSlice = Math.Max(1, options.MaxRequests / options.Rounds);
        var clients = scenarios.Select(s => Enumerable.Range(0, s.Clients).Select(s.NewClient).ToArray()).ToArray();
        try
        {
            await WarmUpAsync(clients, options, capPerSlice, cancellationToken);

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

    private static async Task WarmUpAsync(ILoadClient[][] clients, HarnessOptions options, int capPerSlice, CancellationToken cancellationToken)
    {
        if (options.Warmup <= TimeSpan.Zero)
        {
            return;
        }

        var warmedUp = Stopwatch.StartNew();
        for (var pass = 1; ; pass++)
        {
            var compiledBefore = JitInfo.GetCompiledMethodCount();
            var passClock = Stopwatch.StartNew();
            foreach (var scenarioClients in clients)
            {
                await MeasureAsync(scenarioClients, options.Warmup, capPerSlice, cancellationToken);
            }

            var perSecond = (JitInfo.GetCompiledMethodCount() - compiledBefore) / passClock.Elapsed.TotalSeconds;
            var settled = perSecond < SettledMethodsPerSecond;
            var capped = !settled && warmedUp.Elapsed >= options.MaxWarmup;
            Console.WriteLine($"  warm-up pass {pass}: the JIT compiled {perSecond:0} methods/s" +
                (settled ? " — settled" : capped ? $" — not settled after {warmedUp.Elapsed.TotalSeconds:0} s (--max-warmup-seconds); measuring anyway" : ""));
            if (settled || capped)
            {
                return;
            }
        }
    }

    private static async Task<Slice> MeasureAsync(ILoadClient[] clients, TimeSpan duration, int maxRequests, CancellationToken cancellationToken)
    {
        var result = new Slice();
        var issued = 0;
        var cpuBefore = Process.GetCurrentProcess().TotalProcessorTime;
        var compiledBefore = JitInfo.GetCompiledMethodCount();
        var databaseCpuBefore = PostgresCpu.Total();
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
        result.Finish(latencies.SelectMany(l => l), clock.Elapsed, Process.GetCurrentProcess().TotalProcessorTime - cpuBefore,
            PostgresCpu.Total() - databaseCpuBefore, JitInfo.GetCompiledMethodCount() - compiledBefore);
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
        private TimeSpan _databaseCpu;
        private long _jitCompiled;

        public void Fail(string message)
        {
            Interlocked.Increment(ref _errors);
            Interlocked.CompareExchange(ref _firstError, message, null);
        }

        public void Finish(IEnumerable<long> latencyTicks, TimeSpan elapsed, TimeSpan cpu, TimeSpan databaseCpu, long jitCompiled)
        {
            _latencyTicks.AddRange(latencyTicks);
            _elapsed += elapsed;
            _cpu += cpu;
            _databaseCpu += databaseCpu;
            _jitCompiled += jitCompiled;
        }

        public void Add(Slice other)
        {
            Finish(other._latencyTicks, other._elapsed, other._cpu, other._databaseCpu, other._jitCompiled);
            _errors += other._errors;
            _firstError ??= other._firstError;
        }

        public LoadResult Result(Scenario scenario)
        {
            long[] sorted = [.. _latencyTicks.Order()];
            return new LoadResult(scenario.Name, scenario.Protocol, scenario.Clients, sorted.Length, _errors, _elapsed, _cpu, _databaseCpu, _jitCompiled, sorted, _firstError);
        }
    }
}
