using System.Globalization;
using System.Text;
using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Columns;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Reports;
using BenchmarkDotNet.Running;
using GelDispense.Agent.Formats;
using GelDispense.Agent.Journal;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Stability;

namespace GelDispense.Benchmarks.Agent;

/// <summary>
/// From a stable balance line to a durable journal entry, one addition per invocation: cut the bytes into a line,
/// parse it, judge stability, pass the confirmation gate, and append the pending addition to the SQLite journal
/// (WAL, synchronous=FULL, so every append waits for its fsync). One invocation per iteration and 10,000 iterations,
/// so the iteration statistics are the per-line latency distribution; the P50 and P99 columns are the figures, with
/// no outlier removed (a latency tail is the point). <see cref="StableLineToGate"/> is the same path without the
/// journal, to show what the fsync costs. Goal: P99 below 5 ms.
/// </summary>
[Config(typeof(PerLineConfig))]
public class JournalLatencyBenchmarks
{
    private readonly List<SplitLine> _split = [];
    private string _directory = "";
    private AdditionJournal _journal = null!;
    private LineParser _parser = null!;
    private StabilityDetector _detector = null!;
    private LineSplitter _splitter = null!;
    private StepWindow _window = null!;
    private byte[][] _lines = [];
    private int _next;

    [GlobalSetup]
    public void Setup()
    {
        _directory = Directory.CreateTempSubdirectory("gd-journal-bench-").FullName;
        _journal = AdditionJournal.Open(Path.Combine(_directory, "journal.db"), TimeProvider.System);
        _parser = new LineParser(BuiltInFormats.Column);
        _detector = new StabilityDetector(new StabilitySettings(), TimeProvider.System);
        _splitter = new LineSplitter(_parser.Format.MaxLineLength);
        _window = new StepWindow(0, TargetReadingG: 39.0566, LowReadingG: 38.9344, HighReadingG: 39.1788, TrueGPerReadingG: 1.00114, MlPerReadingG: null);

        // Stable readings in the window, the last digit varying as a balance's does.
        var random = new Random(42);
        _lines = [.. Enumerable.Range(0, 64).Select(_ =>
            Encoding.ASCII.GetBytes(string.Create(CultureInfo.InvariantCulture, $"= +{39.0566 + (random.Next(-5, 6) * 0.0001),10:F4} g\r\n")))];
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        _journal.Dispose();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_directory, recursive: true);
    }

    [Benchmark]
    public JournalEntry StableLineToJournal()
    {
        var netReadingG = StableLineToGate();
        return _journal.AppendPending(new NewAddition(Guid.CreateVersion7(), "b-bench", 0, netReadingG, "balance", "NA-TEOS-24-117"));
    }

    [Benchmark]
    public double StableLineToGate()
    {
        _split.Clear();
        _splitter.Feed(_lines[_next++ % _lines.Length], _split.Add);
        var reading = _parser.Parse(_split[0]).Reading ?? throw new InvalidOperationException("the line did not parse");
        var decision = ConfirmRule.Decide(_detector.Add(reading), linkConnected: true, _window, baselineG: 0, ConfirmMode.Auto, keyPressed: false);
        return decision.Confirm ? decision.NetReadingG!.Value : throw new InvalidOperationException($"the gate held a stable in-window reading: {decision.Reason}");
    }

    /// <summary>One line per iteration, many iterations, with the P50 and P99 of those single-line times.</summary>
    private sealed class PerLineConfig : ManualConfig
    {
        public PerLineConfig()
        {
            AddJob(Job.Default.WithLaunchCount(1).WithWarmupCount(200).WithIterationCount(10_000).WithInvocationCount(1).WithUnrollFactor(1)
                .WithOutlierMode(Perfolizer.Mathematics.OutlierDetection.OutlierMode.DontRemove));
            AddColumn(StatisticColumn.P50, StatisticColumn.P95, new PercentileColumn(99), StatisticColumn.Max);
        }
    }

    /// <summary>A percentile of the iteration times in ms (BenchmarkDotNet's own percentile columns stop at P95 and P100).</summary>
    private sealed class PercentileColumn(int percentile) : IColumn
    {
        public string Id => $"{nameof(PercentileColumn)}.P{percentile}";

        public string ColumnName => $"P{percentile}";

        public bool AlwaysShow => true;

        public ColumnCategory Category => ColumnCategory.Statistics;

        public int PriorityInCategory => percentile;

        public bool IsNumeric => true;

        public UnitType UnitType => UnitType.Time;

        public string Legend => $"{percentile}th percentile of the single-line times";

        public string GetValue(Summary summary, BenchmarkCase benchmarkCase) => GetValue(summary, benchmarkCase, SummaryStyle.Default);

        public string GetValue(Summary summary, BenchmarkCase benchmarkCase, SummaryStyle style) =>
            summary[benchmarkCase]?.ResultStatistics is { } statistics
                ? string.Create(CultureInfo.InvariantCulture, $"{statistics.Percentiles.Percentile(percentile) / 1e6:0.000} ms")
                : "NA";

        public bool IsAvailable(Summary summary) => true;

        public bool IsDefault(Summary summary, BenchmarkCase benchmarkCase) => false;
    }
}
