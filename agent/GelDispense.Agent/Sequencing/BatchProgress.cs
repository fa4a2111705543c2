using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Sequencing;

/// <summary>
/// The batch as the station sees it: the plan in force (step targets, re-planned after an over-pour) and the
/// additions made so far, acknowledged or still pending. The current step is the first one that has a target and
/// no addition. The service is the authority: <see cref="Adopt"/> takes its copy whenever nothing is pending.
/// </summary>
public sealed class BatchProgress
{
    private readonly SortedDictionary<int, PlanStep> _steps = [];
    private readonly List<MadeAddition> _additions = [];

    private BatchProgress(Batch batch)
    {
        BatchId = batch.Id;
        RecipeName = batch.RecipeName;
        Cumulative = IsCumulative(batch.Steps);
        Adopt(batch);
    }

    public string BatchId { get; }

    public string RecipeName { get; }

    /// <summary>True when the plan keeps the vessel on the balance without re-taring (cumulative readings).</summary>
    public bool Cumulative { get; }

    public int PlanRevision { get; private set; }

    public IReadOnlyCollection<PlanStep> Steps => _steps.Values;

    public IReadOnlyList<MadeAddition> Additions => _additions;

    public PlanStep? Current => _steps.Values.FirstOrDefault(IsOpen);

    public int OpenSteps => _steps.Values.Count(IsOpen);

    public PlanStep Step(int index) => _steps[index];

    public static BatchProgress From(Batch batch) => new(batch);

    public bool IsOpen(PlanStep step) => !step.Done && step.TargetMassG > 0 && _additions.All(a => a.StepIndex != step.Index);

    /// <summary>Takes the service's plan in force and additions, keeping the local ones it has not seen yet.</summary>
    public void Adopt(Batch batch)
    {
        var known = batch.Additions.Select(a => new MadeAddition(a.AdditionId, a.StepIndex, a.ReadingG, a.TrueMassG, a.WithinWindow, true)).ToList();
        known.AddRange(_additions.Where(local => known.All(k => k.AdditionId != local.AdditionId)));
        _additions.Clear();
        _additions.AddRange(known);
        _steps.Clear();
        foreach (var step in batch.Steps)
        {
            _steps[step.Index] = step;
        }

        PlanRevision = batch.PlanRevision;
    }

    /// <summary>Records an addition and puts the (possibly re-planned) targets of the remaining steps in force.</summary>
    public void Record(MadeAddition addition, IEnumerable<PlanStep> remainingSteps, int planRevision)
    {
        _additions.RemoveAll(a => a.AdditionId == addition.AdditionId);
        _additions.Add(addition);
        foreach (var step in remainingSteps)
        {
            _steps[step.Index] = step;
        }

        PlanRevision = planRevision;
    }

    /// <summary>The service acknowledged an addition that was pending.</summary>
    public void Acknowledge(string additionId)
    {
        var i = _additions.FindIndex(a => a.AdditionId == additionId);
        if (i >= 0)
        {
            _additions[i] = _additions[i] with { Acknowledged = true };
        }
    }

    /// <summary>A cumulative plan's readings grow from step to step; a re-tared plan repeats each step's own reading.</summary>
    private static bool IsCumulative(IEnumerable<PlanStep> steps) =>
        steps.Where(s => s.TargetMassG > 0).Skip(1).Any(s => s.CumulativeReadingG > s.TargetReadingG * (1 + 1e-9) + 1e-12);
}
