using GelDispense.Agent.Formats;
using GelDispense.Agent.Simulation;

namespace GelDispense.Agent.Tests.Simulation;

/// <summary>The simulated balance's physics, stepped deterministically with seeded generators.</summary>
public class BalanceSimulatorTests
{
    private static readonly TimeSpan Tick = TimeSpan.FromMilliseconds(100);

    private static List<SimulatedSample> Run(BalanceSimulator simulator, int count) =>
        Enumerable.Range(0, count).Select(_ => simulator.Step(Tick)).ToList();

    private static ScriptedTechnician Script(params PourStep[] steps) =>
        new(steps, new TechnicianPace { PauseBetweenSteps = TimeSpan.FromSeconds(1) });

    [Fact]
    public void Noise_scales_with_readability_and_readings_are_quantised_to_d()
    {
        var settings = new SimulatorSettings { ReadabilityG = 0.001, NoiseInReadabilities = 2.0 };
        var samples = Run(new BalanceSimulator(settings, null, new Random(3)), 5000);

        var values = samples.Select(s => s.DisplayedG).ToList();
        var mean = values.Average();
        var sd = Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Count - 1));

        // Gaussian sd 2 d plus uniform rounding d/sqrt(12): sqrt(4 + 1/12) d ≈ 2.02 d.
        Assert.InRange(sd, 1.9 * 0.001, 2.15 * 0.001);
        Assert.All(values, v => Assert.Equal(0, Math.Abs(v / 0.001 - Math.Round(v / 0.001)), 6));
    }

    [Fact]
    public void After_a_pour_the_display_approaches_the_load_as_a_first_order_lag()
    {
        var settings = new SimulatorSettings { NoiseInReadabilities = 0, SettlingTimeConstant = TimeSpan.FromSeconds(1) };
        var technician = new ScriptedTechnician([new PourStep(10.0)], new TechnicianPace { PauseBetweenSteps = TimeSpan.Zero, FastGPerS = 1000, SlowGPerS = 1000 });
        var simulator = new BalanceSimulator(settings, technician, new Random(1));

        var samples = Run(simulator, 30);

        // The whole 10 g lands in the first 0.1 s step; one time constant later the residual is 10·e^-1 g.
        var afterOneTau = samples[10].DisplayedG;
        Assert.Equal(10.0 * (1 - Math.Exp(-1.1)), afterOneTau, 3);
        Assert.True(samples[29].DisplayedG > 9.5);
        Assert.False(samples[5].Stable);
    }

    [Fact]
    public void A_scripted_over_pour_ends_on_the_pan_and_the_balance_flags_stable_once_settled()
    {
        var settings = new SimulatorSettings { NoiseInReadabilities = 0.5 };
        var simulator = new BalanceSimulator(settings, Script(new PourStep(5.0), new PourStep(10.0, OverPourFraction: 0.1)), new Random(9));

        var samples = Run(simulator, 400);

        Assert.True(simulator.Technician!.Finished);
        Assert.Equal(16.0, simulator.TrueNetG, 9);
        Assert.Equal(16.0, samples[^1].DisplayedG, 3);
        Assert.True(samples[^1].Stable);
        Assert.Contains(samples, s => !s.Stable);
    }

    [Fact]
    public void Evaporation_makes_the_settled_reading_fall_at_the_set_rate()
    {
        var settings = new SimulatorSettings { NoiseInReadabilities = 0, EvaporationGPerMin = 0.01 };
        var simulator = new BalanceSimulator(settings, Script(new PourStep(20.0)), new Random(2));
        var samples = Run(simulator, 1800);

        var slopeGPerMin = (samples[1799].DisplayedG - samples[1199].DisplayedG) / 1.0;

        Assert.Equal(-0.01, slopeGPerMin, 3);
    }

    [Fact]
    public void Beyond_capacity_the_balance_shows_overload()
    {
        var settings = new SimulatorSettings { CapacityG = 50 };
        var simulator = new BalanceSimulator(settings, Script(new PourStep(60.0)), new Random(2));

        var samples = Run(simulator, 400);

        Assert.Equal(ReadingKind.Overload, samples[^1].Kind);
        Assert.False(samples[^1].Stable);
    }

    [Fact]
    public void Tare_takes_the_configured_command_only()
    {
        var settings = new SimulatorSettings { NoiseInReadabilities = 0, TareCommand = "T!" };
        var simulator = new BalanceSimulator(settings, Script(new PourStep(5.0)), new Random(2));
        Run(simulator, 200);

        Assert.False(simulator.HandleCommand("T"));
        Assert.True(simulator.HandleCommand("T!"));

        Assert.Equal(0.0, simulator.Step(Tick).DisplayedG, 4);
    }

    [Fact]
    public void The_same_seed_gives_the_same_trace()
    {
        var settings = new SimulatorSettings { GarbageProbability = 0.1 };
        var first = Run(new BalanceSimulator(settings, RandomTechnician.Create(new Random(4), 3, 1, 10, 0.5, new TechnicianPace()), new Random(4)), 300);
        var second = Run(new BalanceSimulator(settings, RandomTechnician.Create(new Random(4), 3, 1, 10, 0.5, new TechnicianPace()), new Random(4)), 300);

        Assert.Equal(first, second);
        Assert.Contains(first, s => s.Garbled);
    }
}
