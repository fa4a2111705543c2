using System.Globalization;
using System.Text;
using BenchmarkDotNet.Attributes;
using GelDispense.Agent.Formats;

namespace GelDispense.Benchmarks.Agent;

/// <summary>
/// Balance line parsing, per line (each invocation handles <see cref="LinesPerInvoke"/> lines, so the reported
/// time is per line; lines/s = 1e9 / mean ns). Goal: at least 1,000,000 lines/s per format.
/// </summary>
[MemoryDiagnoser]
public class LineParsingBenchmarks
{
    private const int LinesPerInvoke = 1000;

    private LineParser _parser = null!;
    private string[] _lines = [];
    private byte[] _stream = [];

    [Params("column", "keyed", "bare")]
    public string Format { get; set; } = "column";

    [GlobalSetup]
    public void Setup()
    {
        var format = BuiltInFormats.Find(Format)!;
        _parser = new LineParser(format);
        var random = new Random(42);
        _lines = Enumerable.Range(0, LinesPerInvoke).Select(_ => Line(Format, Math.Round(random.NextDouble() * 200, 4), random.Next(2) == 0)).ToArray();

        // The stream form mixes endings the way a real adapter can.
        var endings = new[] { "\r\n", "\n", "\r" };
        _stream = Encoding.ASCII.GetBytes(string.Concat(_lines.Select((l, i) => l + endings[i % 3])));
    }

    [Benchmark(OperationsPerInvoke = LinesPerInvoke)]
    public int ParseLines()
    {
        var weights = 0;
        foreach (var line in _lines)
        {
            weights += _parser.Parse(line).IsReading ? 1 : 0;
        }

        return weights;
    }

    [Benchmark(OperationsPerInvoke = LinesPerInvoke)]
    public int SplitAndParseBytes()
    {
        var weights = 0;
        var splitter = new LineSplitter(_parser.Format.MaxLineLength);
        splitter.Feed(_stream, line => weights += _parser.Parse(line).IsReading ? 1 : 0);
        return weights;
    }

    private static string Line(string format, double valueG, bool stable)
    {
        var value = valueG.ToString("F4", CultureInfo.InvariantCulture);
        return format switch
        {
            "column" => $"{(stable ? '=' : '~')} +{value,10} g",
            "keyed" => $"mass={value},unit=g,steady={(stable ? 1 : 0)}",
            _ => value,
        };
    }
}
