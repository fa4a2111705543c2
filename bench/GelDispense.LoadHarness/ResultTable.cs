using System.Globalization;
using System.Text;

namespace GelDispense.LoadHarness;

/// <summary>The results as a Markdown table, with each plan row set against the no-op row of the same protocol.</summary>
public static class ResultTable
{
    public const string NoOp = "no-op POST /v1/ping";
    public const string PlanRepeated = "plan POST /v1/plans, same request (memo)";
    public const string PlanComputed = "plan POST /v1/plans, new batch size each call (computed)";

    /// <summary>The goal of the service issue: the plan call keeps at least 80 % of the no-op throughput.</summary>
    public const double GoalRatio = 0.80;

    public static string Format(IReadOnlyList<LoadResult> results)
    {
        var table = new StringBuilder()
            .AppendLine("| scenario | protocol | clients | requests | errors | req/s | p50 ms | p99 ms | CPU ms/req | plan/no-op req/s | plan/no-op p50 |")
            .AppendLine("|---|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|");
        foreach (var r in results)
        {
            var baseline = IsPlan(r) ? results.FirstOrDefault(b => b.Scenario == NoOp && b.Protocol == r.Protocol) : null;
            var throughputRatio = baseline is null ? "" : F("0.00", r.RequestsPerSecond / baseline.RequestsPerSecond);
            var latencyRatio = baseline is null ? "" : F("0.00", r.PercentileMs(0.50) / baseline.PercentileMs(0.50));
            table.AppendLine(CultureInfo.InvariantCulture,
                $"| {r.Scenario} | {r.Protocol} | {r.Clients} | {r.Requests} | {r.Errors} | {F("0", r.RequestsPerSecond)} | " +
                $"{F("0.00", r.PercentileMs(0.50))} | {F("0.00", r.PercentileMs(0.99))} | {F("0.000", r.CpuMsPerRequest)} | {throughputRatio} | {latencyRatio} |");
        }

        return table.ToString();
    }

    /// <summary>One line per protocol: whether the plan call reached the goal ratio.</summary>
    public static IEnumerable<string> Verdicts(IReadOnlyList<LoadResult> results) =>
        from plan in results.Where(IsPlan)
        let noOp = results.First(r => r.Scenario == NoOp && r.Protocol == plan.Protocol)
        let ratio = plan.RequestsPerSecond / noOp.RequestsPerSecond
        select $"{plan.Protocol}, {plan.Scenario}: {F("0", ratio * 100)} % of the no-op throughput " +
            (ratio >= GoalRatio ? $"(goal ≥ {F("0", GoalRatio * 100)} %: met)" : $"(goal ≥ {F("0", GoalRatio * 100)} %: NOT met)");

    private static bool IsPlan(LoadResult result) => result.Scenario is PlanRepeated or PlanComputed;

    private static string F(string format, double value) => value.ToString(format, CultureInfo.InvariantCulture);
}
