using GelDispense.Agent.Sequencing;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Tests.Sequencing;

public sealed class BatchProgressTests
{
    private static Batch ThreeSteps(bool cumulative = false)
    {
        var batch = new Batch { Id = "b-1", RecipeName = "test sol", PlanRevision = 0 };
        var readings = new[] { 10.0, 5.0, 2.0 };
        var total = 0.0;
        for (var i = 0; i < readings.Length; i++)
        {
            total += readings[i];
            batch.Steps.Add(new PlanStep { Index = i, ReagentId = $"r{i}", TargetMassG = readings[i], TargetReadingG = readings[i], CumulativeReadingG = cumulative ? total : readings[i], AcceptanceG = 0.1 });
        }

        return batch;
    }

    [Fact]
    public void The_current_step_is_the_first_with_a_target_and_no_addition()
    {
        var progress = BatchProgress.From(ThreeSteps());
        Assert.Equal(0, progress.Current!.Index);

        progress.Record(new MadeAddition("a", 0, 10, 10, true, true), [], 0);

        Assert.Equal(1, progress.Current!.Index);
        Assert.Equal(2, progress.OpenSteps);
    }

    [Fact]
    public void Recording_an_out_of_window_addition_puts_the_replanned_targets_in_force()
    {
        var progress = BatchProgress.From(ThreeSteps());

        progress.Record(new MadeAddition("a", 0, 10.5, 10.5, false, true), [new PlanStep { Index = 1, ReagentId = "r1", TargetMassG = 5.25, TargetReadingG = 5.25 }], 1);

        Assert.Equal(5.25, progress.Current!.TargetReadingG);
        Assert.Equal(1, progress.PlanRevision);
        Assert.Equal(2.0, progress.Step(2).TargetReadingG);
    }

    [Fact]
    public void Adopting_the_services_batch_keeps_local_additions_it_has_not_seen()
    {
        var progress = BatchProgress.From(ThreeSteps());
        progress.Record(new MadeAddition("sent", 0, 10, 10, true, false), [], 0);
        progress.Record(new MadeAddition("local", 1, 5, 5, true, false), [], 0);
        var fromService = ThreeSteps();
        fromService.Additions.Add(new Addition { AdditionId = "sent", StepIndex = 0, ReadingG = 10, TrueMassG = 10, WithinWindow = true });

        progress.Adopt(fromService);

        Assert.Equal(["sent", "local"], progress.Additions.Select(a => a.AdditionId));
        Assert.True(progress.Additions[0].Acknowledged);
        Assert.False(progress.Additions[1].Acknowledged);
        Assert.Equal(2, progress.Current!.Index);
    }

    [Fact]
    public void A_plan_whose_readings_grow_from_step_to_step_is_cumulative()
    {
        Assert.True(BatchProgress.From(ThreeSteps(cumulative: true)).Cumulative);
        Assert.False(BatchProgress.From(ThreeSteps(cumulative: false)).Cumulative);
    }

    [Fact]
    public void A_step_with_no_target_or_marked_done_is_never_current()
    {
        var batch = ThreeSteps();
        batch.Steps[0].Done = true;
        batch.Steps[1].TargetMassG = 0;

        Assert.Equal(2, BatchProgress.From(batch).Current!.Index);
    }
}
