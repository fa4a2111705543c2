using BenchmarkDotNet.Columns;
using BenchmarkDotNet.Reports;
using BenchmarkDotNet.Running;

namespace GelDispense.Benchmarks.Service;

/// <summary>
/// Mean time over the mean of the same benchmark at the smallest value of one parameter, so the sizes of a
/// [Params] compare side by side (BenchmarkDotNet's own Ratio compares methods or jobs, not parameter values).
/// </summary>
public sealed class RatioToSmallestColumn(string parameter) : IColumn
{
    public string Id => $"RatioTo{parameter}";

    public string ColumnName => $"Ratio to smallest {parameter}";

    public bool AlwaysShow => true;

    public ColumnCategory Category => ColumnCategory.Custom;

    public int PriorityInCategory => 0;

    public bool IsNumeric => true;

    public UnitType UnitType => UnitType.Dimensionless;

    public string Legend => $"Mean / mean of the same benchmark at the smallest {parameter}";

    public bool IsDefault(Summary summary, BenchmarkCase benchmarkCase) => false;

    public bool IsAvailable(Summary summary) => true;

    public string GetValue(Summary summary, BenchmarkCase benchmarkCase) => GetValue(summary, benchmarkCase, SummaryStyle.Default);

    public string GetValue(Summary summary, BenchmarkCase benchmarkCase, SummaryStyle style)
    {
        var smallest = summary.BenchmarksCases
            .Where(c => c.Descriptor == benchmarkCase.Descriptor && c.Job == benchmarkCase.Job)
            .MinBy(c => Convert.ToDouble(c.Parameters[parameter], System.Globalization.CultureInfo.InvariantCulture));
        var mean = summary[benchmarkCase]?.ResultStatistics?.Mean;
        var baseline = smallest is null ? null : summary[smallest]?.ResultStatistics?.Mean;
        return mean is { } m && baseline is > 0 ? (m / baseline.Value).ToString("0.00", System.Globalization.CultureInfo.InvariantCulture) : "?";
    }
}
