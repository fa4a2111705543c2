using System.Diagnostics;

namespace GelDispense.LoadHarness;

/// <summary>
/// What one scenario measured: completed calls, failures, wall time, the CPU time of this process (clients and
/// service together), that of the PostgreSQL processes, the methods the JIT compiled meanwhile (near zero once warm)
/// and every call's latency.
/// </summary>
public sealed record LoadResult(
    string Scenario, string Protocol, int Clients, int Requests, int Errors, TimeSpan Elapsed, TimeSpan ProcessCpu, TimeSpan DatabaseCpu, long JitCompiled,
    long[] SortedLatencyTicks, string? FirstError)
{
    public double RequestsPerSecond => Requests / Elapsed.TotalSeconds;

    /// <summary>CPU per call, client and service together. Unlike wall-clock figures it barely moves when other processes load the machine.</summary>
    public double CpuMsPerRequest => Requests == 0 ? double.NaN : ProcessCpu.TotalMilliseconds / Requests;

    /// <summary>PostgreSQL's CPU per call; 0 on runs that do not use it.</summary>
    public double DatabaseCpuMsPerRequest => Requests == 0 ? double.NaN : DatabaseCpu.TotalMilliseconds / Requests;

    /// <summary>Nearest-rank percentile of the call latencies, in ms.</summary>
    public double PercentileMs(double fraction)
    {
        if (SortedLatencyTicks.Length == 0)
        {
            return double.NaN;
        }

        var rank = (int)Math.Ceiling(fraction * SortedLatencyTicks.Length);
        return SortedLatencyTicks[Math.Clamp(rank, 1, SortedLatencyTicks.Length) - 1] * 1000.0 / Stopwatch.Frequency;
    }
}
