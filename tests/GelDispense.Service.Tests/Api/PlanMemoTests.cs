using GelDispense.Chemistry.Errors;
using GelDispense.Contracts.V1;
using GelDispense.Service.Api;
using Google.Protobuf;

namespace GelDispense.Service.Tests.Api;

public sealed class PlanMemoTests
{
    private static readonly BalanceProfile Balance = new() { Id = "bal-7", ReadabilityG = 0.001, CapacityG = 220 };

    [Fact]
    public async Task The_same_request_is_planned_once_and_every_caller_gets_its_own_copy()
    {
        using var memo = new PlanMemo(new SerializedAnswers());
        var key = PlanMemo.Key(new Recipe { Name = "silica-r4" }, Balance, null, null, null);
        var computed = 0;
        Task<DispensingPlan> Plan()
        {
            computed++;
            return Task.FromResult(new DispensingPlan { Feasible = true, Steps = { new PlanStep { Index = 0, ReagentId = "teos", TargetMassG = 20.83 } } });
        }

        var first = await memo.GetOrPlanAsync(key, Plan);
        first.Steps[0].TargetMassG = 99;
        var second = await memo.GetOrPlanAsync(PlanMemo.Key(new Recipe { Name = "silica-r4" }, Balance, null, null, null), Plan);

        Assert.Equal(1, computed);
        Assert.Equal(20.83, second.Steps[0].TargetMassG);
    }

    [Fact]
    public async Task An_answer_sent_as_is_is_the_remembered_plan_itself_with_its_bytes_kept_from_the_second_ask_while_a_copy_has_none()
    {
        var serialized = new SerializedAnswers();
        using var memo = new PlanMemo(serialized);
        var key = PlanMemo.Key(new Recipe { Name = "silica-r8" }, Balance, null, null, null);
        static Task<DispensingPlan> Plan() =>
            Task.FromResult(new DispensingPlan { Feasible = true, Steps = { new PlanStep { Index = 0, ReagentId = "teos", TargetMassG = 20.83 } } });

        var answer = await memo.AnswerAsync(key, Plan);
        var keptAtFirst = serialized.TryGet(answer, out _);
        var again = await memo.AnswerAsync(key, () => throw new InvalidOperationException("planned twice"));
        var copy = await memo.GetOrPlanAsync(key, () => throw new InvalidOperationException("planned twice"));

        Assert.False(keptAtFirst);
        Assert.Same(answer, again);
        Assert.True(serialized.TryGet(answer, out var kept));
        Assert.Equal(answer.ToByteArray(), kept);
        Assert.NotSame(answer, copy);
        Assert.False(serialized.TryGet(copy, out _));
    }

    [Fact]
    public async Task A_plan_the_memo_drops_for_want_of_room_takes_its_kept_bytes_with_it()
    {
        var serialized = new SerializedAnswers();
        var plan = new DispensingPlan { Feasible = true, Warnings = { new string('w', 4000) } };
        Task<DispensingPlan> Plan() => Task.FromResult(plan.Clone());
        // Room for three of these plans (each counted twice: the plan and its bytes) but not four.
        using var memo = new PlanMemo(serialized, capacityBytes: 3 * (2L * plan.CalculateSize() + 100));
        var keys = Enumerable.Range(1, 4)
            .Select(volume => PlanMemo.Key(new Recipe { Name = "silica-r4", Scale = new BatchScale { GelVolumeMl = volume } }, Balance, null, null, null))
            .ToList();
        var answers = new List<DispensingPlan>();
        foreach (var key in keys[..3])
        {
            await memo.AnswerAsync(key, Plan);
            answers.Add(await memo.AnswerAsync(key, Plan));
        }

        var keptBefore = answers.Count(answer => serialized.TryGet(answer, out _));
        await memo.AnswerAsync(keys[3], Plan);
        // The memo compacts and calls back on the thread pool; ten seconds is ample on any machine.
        for (var wait = 0; wait < 200 && answers.All(answer => serialized.TryGet(answer, out _)); wait++)
        {
            await Task.Delay(50);
        }

        Assert.Equal(3, keptBefore);
        Assert.Contains(answers, answer => !serialized.TryGet(answer, out _));
    }

    [Fact]
    public async Task A_request_that_failed_is_planned_again_next_time()
    {
        using var memo = new PlanMemo(new SerializedAnswers());
        var key = PlanMemo.Key(new Recipe { Name = "needs-a-custom-reagent" }, Balance, null, null, null);

        await Assert.ThrowsAsync<InvalidInputException>(() => memo.GetOrPlanAsync(key,
            () => throw new InvalidInputException("recipe.components[0].reagentId", "ipa-dry", "no such reagent")));
        var plan = await memo.GetOrPlanAsync(key, () => Task.FromResult(new DispensingPlan { Feasible = true }));

        Assert.True(plan.Feasible);
    }

    [Fact]
    public void Requests_that_differ_in_any_device_or_option_have_different_keys()
    {
        var recipe = new Recipe { Name = "silica-r4" };

        var plain = PlanMemo.Key(recipe, Balance, null, null, null);
        var warmer = PlanMemo.Key(recipe, Balance, null, new AirConditions { TemperatureC = 25 }, null);
        var withPipette = PlanMemo.Key(recipe, Balance, new PipetteProfile { Id = "P1000", NominalVolumeUl = 1000, MinVolumeUl = 100 }, null, null);
        var inASmallVessel = PlanMemo.Key(recipe, Balance, null, null, new PlanOptions { VesselCapacityMl = 250 });

        Assert.NotEqual(plain, warmer);
        Assert.NotEqual(plain, withPipette);
        Assert.NotEqual(plain, inASmallVessel);
    }
}
