using GelDispense.Agent.Demo;
using GelDispense.Contracts.V1;

namespace GelDispense.ScaleOut.Tests.Support;

/// <summary>One addition a test means to record: its id, step, net reading and lot.</summary>
internal sealed record PlannedAddition(string AdditionId, int StepIndex, double ReadingG, string LotId)
{
    /// <summary>
    /// Splits the weighed steps of a freshly planned batch into <paramref name="count"/> additions, step by step in
    /// turn, each a share of its step's target reading to the balance's 1 mg readability. Partial pours are out of
    /// window one by one, so the service re-plans as they arrive, which is part of what the replicas must agree on.
    /// </summary>
    public static IReadOnlyList<PlannedAddition> Split(Batch batch, int count, string prefix)
    {
        var steps = batch.Steps.Where(s => s.TargetReadingG > 0).ToArray();
        var perStep = steps.Select((_, s) => Enumerable.Range(0, count).Count(i => i % steps.Length == s)).ToArray();
        return [.. Enumerable.Range(0, count).Select(i =>
        {
            var step = steps[i % steps.Length];
            var readingG = Math.Round(step.TargetReadingG / perStep[i % steps.Length], 3);
            return new PlannedAddition($"{prefix}-{i:D3}", step.Index, readingG, DemoScenario.Lots[step.ReagentId]);
        })];
    }
}
