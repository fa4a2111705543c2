using System.Globalization;
using System.Text;

namespace GelDispense.LoadHarness;

/// <summary>
/// The results as a Markdown table, each row set against its baseline where it has one: a plan call against the
/// no-op of the same protocol, addition ingest and the storage write alone against the raw insert loop.
/// </summary>
public static class ResultTable
{
    public const string NoOp = "no-op POST /v1/ping";
    public const string PlanRepeated = "plan POST /v1/plans, same request (memo)";
    public const string PlanComputed = "plan POST /v1/plans, new batch size each call (computed)";

    /// <summary>The goal of the service issue: the plan call keeps at least 80 % of the no-op throughput.</summary>
    public const double GoalRatio = 0.80;

    /// <summary>The ingest goals of the load-harness issue: at least 2,000 additions/s and at least half the raw insert rate.</summary>
    public const double IngestGoalPerSecond = 2000;

    public const double IngestGoalRatio = 0.50;

    public static string Format(IReadOnlyList<LoadResult> results)
    {
        var table = new StringBuilder()
            .AppendLine("| scenario | protocol | clients | requests | errors | req/s | p50 ms | p99 ms | CPU ms/req | PostgreSQL CPU ms/req | JIT methods | vs baseline req/s | vs baseline p50 |")
            .AppendLine("|---|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|");
        foreach (var r in results)
        {
            var baseline = Baseline(r, results);
            var throughputRatio = baseline is null ? "" : F("0.00", r.RequestsPerSecond / baseline.RequestsPerSecond);
            var latencyRatio = baseline is null ? "" : F("0.00", r.PercentileMs(0.50) / baseline.PercentileMs(0.50));
            table.AppendLine(CultureInfo.InvariantCulture,
                $"| {r.Scenario} | {r.Protocol} | {r.Clients} | {r.Requests} | {r.Errors} | {F("0", r.RequestsPerSecond)} | " +
                $"{F("0.00", r.PercentileMs(0.50))} | {F("0.00", r.PercentileMs(0.99))} | {F("0.000", r.CpuMsPerRequest)} | {(r.DatabaseCpu > TimeSpan.Zero ? F("0.000", r.DatabaseCpuMsPerRequest) : "")} | {r.JitCompiled} | {throughputRatio} | {latencyRatio} |");
        }

        return table.ToString();
    }

    /// <summary>One line per compared row: whether it reached its goal.</summary>
    public static IEnumerable<string> Verdicts(IReadOnlyList<LoadResult> results)
    {
        foreach (var r in results)
        {
            if (Baseline(r, results) is not { } baseline)
            {
                continue;
            }

            var ratio = r.RequestsPerSecond / baseline.RequestsPerSecond;
            if (r.Scenario == IngestScenarios.StoredWrite)
            {
                yield return $"{r.Scenario}: {F("0", r.RequestsPerSecond)} additions/s, {F("0", ratio * 100)} % of the raw inserts (no goal: the database's part)";
                continue;
            }

            var ofStoredWrite = r.Scenario == IngestScenarios.Ingest && results.FirstOrDefault(b => b.Scenario == IngestScenarios.StoredWrite) is { } write
                ? $", {F("0", r.RequestsPerSecond / write.RequestsPerSecond * 100)} % of the storage write alone"
                : "";
            yield return r.Scenario == IngestScenarios.Ingest
                ? $"{r.Protocol}, {r.Scenario}: {F("0", r.RequestsPerSecond)} additions/s, {F("0", ratio * 100)} % of the raw inserts{ofStoredWrite} " +
                    $"(goal ≥ {F("0", IngestGoalPerSecond)}/s and ≥ {F("0", IngestGoalRatio * 100)} %: " +
                    $"{(r.RequestsPerSecond >= IngestGoalPerSecond && ratio >= IngestGoalRatio ? "met" : "NOT met")})"
                : $"{r.Protocol}, {r.Scenario}: {F("0", ratio * 100)} % of the no-op throughput " +
                    $"(goal ≥ {F("0", GoalRatio * 100)} %: {(ratio >= GoalRatio ? "met" : "NOT met")})";
        }
    }

    private static LoadResult? Baseline(LoadResult result, IReadOnlyList<LoadResult> results) => result.Scenario switch
    {
        PlanRepeated or PlanComputed => results.FirstOrDefault(b => b.Scenario == NoOp && b.Protocol == result.Protocol),
        IngestScenarios.Ingest or IngestScenarios.StoredWrite => results.FirstOrDefault(b => b.Scenario == IngestScenarios.RawInsert),
        _ => null,
    };

    private static string F(string format, double value) => value.ToString(format, CultureInfo.InvariantCulture);
}
