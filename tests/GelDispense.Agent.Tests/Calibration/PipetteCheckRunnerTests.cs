using GelDispense.Agent.Calibration;
using GelDispense.Agent.Demo;
using GelDispense.Agent.Formats;
using GelDispense.Agent.Simulation;
using GelDispense.Agent.Stability;
using GelDispense.Agent.Tests.Support;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Metrology;

namespace GelDispense.Agent.Tests.Calibration;

/// <summary>A guided check of a 1000 µL pipette on a simulated 0.1 mg balance over a pseudo-terminal.</summary>
[Collection(StationCollection.Name)]
public sealed class PipetteCheckRunnerTests : TempDirectoryTest
{
    private static readonly PipetteProfile Pipette = new("P1000-07", 1000, 100);

    private static PipetteCheckPlan Plan(int count) => new(Pipette, 1000, count, TemperatureC: 20, PressureHpa: 1013.25, RelativeHumidityPct: 50, TareCommand: "T", ReadabilityG: 0.0001);

    private async Task<PipetteCheckResult> RunAsync(PipetteCheckPlan plan, IReadOnlyDictionary<int, double> offByDelivery)
    {
        var settings = new SimulatorSettings { ReadabilityG = 0.0001, SettlingTimeConstant = TimeSpan.FromMilliseconds(80), SampleInterval = TimeSpan.FromMilliseconds(20), TareCommand = "T" };
        PipetteCheckRunner? runner = null;
        var technician = new FollowingTechnician(() => runner?.CurrentView, offByDelivery, new TechnicianPace { FastGPerS = 5, SlowGPerS = 1 }, TimeSpan.FromMilliseconds(150));
        using var port = new PtySimulatorPort(Path.Combine(Dir, "balance"));
        using var stop = new CancellationTokenSource(TimeSpan.FromSeconds(60));
        var host = new SimulatorHost(new BalanceSimulator(settings, technician, new Random(5)), new SampleRenderer(BuiltInFormats.Column, 0.0001, new Random(6)), port, settings, TimeProvider.System);
        var hosting = host.RunAsync(null, stop.Token);
        await using var link = FastLinks.Serial(port.SlavePath);
        runner = new PipetteCheckRunner(link, new LineParser(BuiltInFormats.Column), new StabilitySettings(), new RecordingDisplay(), TimeProvider.System);
        try
        {
            return await runner.RunAsync(plan, stop.Token);
        }
        finally
        {
            await stop.CancelAsync();
            try
            {
                await hosting;
            }
            catch (OperationCanceledException)
            {
                // The simulator serves until it is told to stop.
            }
        }
    }

    [Fact]
    public async Task Deliveries_of_the_set_volume_pass_against_the_iso_8655_limits()
    {
        var result = await RunAsync(Plan(4), new Dictionary<int, double>());

        Assert.Equal(4, result.Count);
        // Z at 20 °C and 101.3 kPa is 1.0029 µL/mg (ISO 8655-6 table; status V2 in published-values.md §1).
        Assert.Equal(1.0029, result.ZFactorUlPerMg, 4);
        // ISO 8655-2, 1000 µL: systematic ± 8 µL, random 3 µL (status V in published-values.md §2).
        Assert.Equal(8, result.SystematicMpeUl);
        Assert.Equal(3, result.RandomMpeUl);
        Assert.InRange(result.MeanVolumeUl, 999, 1001);
        Assert.True(result.Passed);
    }

    [Fact]
    public async Task Deliveries_two_percent_over_fail_on_the_systematic_limit()
    {
        var twoPercentOver = Enumerable.Range(0, 4).ToDictionary(i => i, _ => 0.02);

        var result = await RunAsync(Plan(4), twoPercentOver);

        Assert.InRange(result.SystematicErrorUl, 19, 21);
        Assert.False(result.SystematicPass);
        Assert.False(result.Passed);
        Assert.Contains(PipetteCheckText.Lines(result), l => l.Contains("FAIL", StringComparison.Ordinal));
    }

    [Fact]
    public void A_volume_outside_the_pipettes_range_is_refused_before_any_delivery()
    {
        var ex = Assert.Throws<InvalidInputException>(() => PipetteCheckRunner.Check(Plan(10) with { SelectedVolumeUl = 5000 }));

        Assert.Contains(ex.Errors, e => e.Field == "--volume" && e.Value == "5000");
    }

    [Fact]
    public void A_single_delivery_is_refused_because_a_spread_needs_two()
    {
        var ex = Assert.Throws<InvalidInputException>(() => PipetteCheckRunner.Check(Plan(1)));

        Assert.Contains(ex.Errors, e => e.Field == "--count");
    }
}
