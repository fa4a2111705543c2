using GelDispense.Agent.Configuration;
using GelDispense.Agent.Demo;
using GelDispense.Agent.Journal;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Simulation;
using GelDispense.Agent.Station;
using GelDispense.Agent.Tests.Support;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Tests.Station;

/// <summary>
/// The whole loop, all real: the service in-process over loopback HTTP/2 on SQLite, the simulated balance on a
/// pseudo-terminal read through System.IO.Ports, the journal on disk, and a technician who works from the screen.
/// </summary>
[Collection(StationCollection.Name)]
public sealed class StationRunnerTests : TempDirectoryTest
{
    private static readonly TimeSpan Limit = TimeSpan.FromSeconds(90);

    private static readonly TechnicianPace Quick = DemoScenario.Pace;

    [Fact]
    public async Task A_batch_with_one_over_pour_is_made_step_by_step_recorded_once_each_and_completed_within_spec()
    {
        await using var rig = await StationRig.StartAsync(Dir, DemoScenario.OverPours, Quick);
        using var limit = new CancellationTokenSource(Limit);
        var batch = await rig.StartDemoBatchAsync(limit.Token);

        var result = await rig.RunAsync(batch, limit.Token);

        var stored = await rig.ServiceBatchAsync(batch.Id);
        Assert.True(result.Completed, rig.Display.Log);
        Assert.Equal(BatchStatus.Completed, stored.Status);
        Assert.Equal(Enumerable.Range(0, 6), stored.Additions.Select(a => a.StepIndex).Order());
        Assert.Equal(6, stored.Additions.Select(a => a.AdditionId).Distinct().Count());
        Assert.False(stored.Additions.Single(a => a.StepIndex == 0).WithinWindow);
        Assert.All(stored.Additions.Where(a => a.StepIndex > 0), a => Assert.True(a.WithinWindow, $"step {a.StepIndex} out of window\n{rig.Display.Log}"));
        Assert.Equal(1, stored.PlanRevision);
        Assert.True(result.AsMade!.WithinSpec, rig.Display.Log);
        Assert.True(rig.Display.Said("RE-PLANNED"));
        Assert.Equal(stored.Additions.Select(a => a.AdditionId).Order(), rig.Session.Journal.ForBatch(batch.Id).Select(e => e.AdditionId).Order());
        Assert.All(rig.Session.Journal.ForBatch(batch.Id), e => Assert.Equal(JournalState.Sent, e.State));
    }

    [Fact]
    public async Task With_the_service_killed_mid_batch_the_station_goes_on_offline_and_every_addition_is_recorded_exactly_once_after_it_restarts()
    {
        // The over-pour falls on step 2 (MTMS), which the station makes while the service is down: it re-plans by itself.
        await using var rig = await StationRig.StartAsync(Dir, new Dictionary<int, double> { [1] = 0.03 }, Quick);
        using var limit = new CancellationTokenSource(Limit);
        var batch = await rig.StartDemoBatchAsync(limit.Token);
        var running = rig.RunAsync(batch, limit.Token);

        await rig.WaitForAsync(() => rig.Runner?.CurrentView is { StepIndex: 1, Phase: StepPhase.Adding }, Limit, "step 2 to open");
        await rig.KillServiceAsync();
        await rig.WaitForAsync(() => rig.Runner?.CurrentView is { StepIndex: 4, PendingAdditions: >= 3 }, Limit, "three additions made offline");
        Assert.True(rig.Display.Said("OFFLINE"), rig.Display.Log);
        Assert.True(rig.Display.Said("judged by the station (offline)"), rig.Display.Log);
        Assert.True(rig.Display.Said("RE-PLANNED"), rig.Display.Log);
        await rig.RestartServiceAsync();
        var result = await running;

        var stored = await rig.ServiceBatchAsync(batch.Id);
        var journaled = rig.Session.Journal.ForBatch(batch.Id);
        Assert.Equal(0, result.PendingAdditions);
        Assert.True(result.Completed, rig.Display.Log);
        Assert.Equal(journaled.Select(e => e.AdditionId), stored.Additions.Select(a => a.AdditionId));
        Assert.Equal(Enumerable.Range(0, 6), stored.Additions.Select(a => a.StepIndex));
        Assert.All(journaled, e => Assert.Equal(JournalState.Sent, e.State));
        Assert.False(stored.Additions.Single(a => a.StepIndex == 1).WithinWindow);
        Assert.All(stored.Additions.Where(a => a.StepIndex != 1), a => Assert.True(a.WithinWindow, $"step {a.StepIndex} out of window\n{rig.Display.Log}"));
        Assert.True(result.AsMade!.Complete);
        Assert.True(result.AsMade.WithinSpec, rig.Display.Log);
    }

    [Fact]
    public async Task A_balance_unplugged_mid_step_reconnects_and_the_step_is_confirmed_only_on_a_reading_taken_after_it_came_back()
    {
        // The cable is pulled from the simulator's own thread once 1 g of the MTMS is on the pan, so the cut falls
        // mid-pour however late a loaded machine would notice it; the technician goes on pouring while the line is down.
        const double cutAtG = 1.0;
        CableCutter? cutter = null;
        var slow = Quick with { FastGPerS = 3, SlowGPerS = 1.5 };
        await using var rig = await StationRig.StartAsync(Dir, new Dictionary<int, double>(), slow, alongside: (t, port) => cutter = new CableCutter(t, port, step: 1, cutAtG));
        using var limit = new CancellationTokenSource(Limit);
        var batch = await rig.StartDemoBatchAsync(limit.Token);
        var running = rig.RunAsync(batch, limit.Token);

        await rig.WaitForAsync(() => rig.Display.Said("balance Lost"), Limit, "the link to be lost");
        await Task.Delay(TimeSpan.FromSeconds(2.5));
        rig.Port.RequestRestore();
        var result = await running;

        var mtms = rig.Session.Journal.ForBatch(batch.Id).Single(e => e.StepIndex == 1);
        var stored = await rig.ServiceBatchAsync(batch.Id);
        Assert.True(result.Completed, rig.Display.Log);
        Assert.True(mtms.ConfirmedAt > rig.Port.RestoredAt, $"confirmed at {mtms.ConfirmedAt:O}, line restored at {rig.Port.RestoredAt:O}\n{rig.Display.Log}");
        // Not a stale pre-cut reading: what was confirmed includes what was poured while the line was down.
        Assert.True(mtms.ReadingG > cutter!.PouredAtCutG + 1.0, $"confirmed {mtms.ReadingG} g, the pan held {cutter.PouredAtCutG} g at the cut");
        Assert.True(stored.Additions.Single(a => a.StepIndex == 1).WithinWindow, rig.Display.Log);
        Assert.Equal(6, stored.Additions.Count);
        Assert.True(rig.Display.Said("balance Connected") && rig.Display.Notes.Count(n => n.Text.StartsWith("balance Connected", StringComparison.Ordinal)) >= 2, rig.Display.Log);
    }

    [Fact]
    public async Task A_pipette_step_shows_the_volume_to_deliver_and_is_confirmed_once_the_balance_has_weighed_the_delivery()
    {
        await using var rig = await StationRig.StartAsync(Dir, new Dictionary<int, double>(), Quick, RigDevices.TopLoaderWithPipette);
        using var limit = new CancellationTokenSource(Limit);
        var batch = await rig.StartDemoBatchAsync(limit.Token);
        var ammonia = batch.Steps.Single(s => s.ReagentId == "nh3-1m");
        Assert.Equal(DispensingMethod.Pipette, ammonia.Method);

        var result = await rig.RunAsync(batch, limit.Token);

        var stored = await rig.ServiceBatchAsync(batch.Id);
        var delivered = stored.Additions.Single(a => a.StepIndex == ammonia.Index);
        Assert.True(result.Completed, rig.Display.Log);
        Assert.Equal(6, stored.Additions.Count);
        Assert.True(rig.Display.Said("µL by pipette, then the balance checks it"), rig.Display.Log);
        Assert.True(rig.Display.Said("pipette delivery weighed"), rig.Display.Log);
        // What was weighed is the delivery, not a part of it: within a few percent of the first plan's target (a re-plan
        // after a coarse reading elsewhere may move the target a little).
        Assert.InRange(delivered.ReadingG, ammonia.TargetReadingG * 0.97, ammonia.TargetReadingG * 1.03);
    }

    [Fact]
    public async Task A_batch_started_in_a_configured_vessel_is_planned_and_kept_with_its_tare_and_capacity()
    {
        await using var rig = await StationRig.StartAsync(Dir, new Dictionary<int, double>(), Quick);
        using var limit = new CancellationTokenSource(Limit);
        var vessel = new VesselConfig { TareG = 63.5, CapacityMl = 150 };

        var batch = await rig.Session.StartAsync(
            new BatchStart(DemoScenario.Recipe(), null, rig.Devices.Balance, rig.Devices.Pipette, Options: vessel.ToPlanOptions()), rig.Display, limit.Token);

        var stored = await rig.ServiceBatchAsync(batch.Id);
        Assert.Equal((63.5, 150.0), (stored.Options.VesselTareG, stored.Options.VesselCapacityMl));
    }

    [Fact]
    public async Task A_vessel_kept_on_the_balance_gets_running_targets_and_its_batch_is_weighed_without_re_taring_within_spec()
    {
        await using var rig = await StationRig.StartAsync(Dir, new Dictionary<int, double>(), Quick);
        using var limit = new CancellationTokenSource(Limit);
        var batch = await rig.Session.StartAsync(
            new BatchStart(DemoScenario.Recipe(), null, rig.Devices.Balance, rig.Devices.Pipette, Options: new VesselConfig { Cumulative = true }.ToPlanOptions()), rig.Display, limit.Token);

        var result = await rig.RunAsync(batch, limit.Token);

        var stored = await rig.ServiceBatchAsync(batch.Id);
        Assert.True(result.Completed, rig.Display.Log);
        Assert.True(rig.Display.Said("cumulative readings"), rig.Display.Log);
        Assert.Equal(6, stored.Additions.Count);
        Assert.All(stored.Additions, a => Assert.True(a.WithinWindow, $"step {a.StepIndex} out of window\n{rig.Display.Log}"));
        Assert.True(result.AsMade!.WithinSpec, rig.Display.Log);
    }

    /// <summary>Pulls the balance cable once the given step has the given mass poured.</summary>
    private sealed class CableCutter(ITechnician inner, ControlledPort port, int step, double cutAtG) : ITechnician
    {
        private double _pouredG;

        public double PouredAtCutG { get; private set; } = double.NaN;

        public bool Finished => inner.Finished;

        public int StepIndex => inner.StepIndex;

        public double Pour(TimeSpan dt)
        {
            var amount = inner.Pour(dt);
            if (inner.StepIndex == step && double.IsNaN(PouredAtCutG))
            {
                _pouredG += amount;
                if (_pouredG >= cutAtG)
                {
                    PouredAtCutG = _pouredG;
                    port.RequestCut();
                }
            }

            return amount;
        }
    }
}
