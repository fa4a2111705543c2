using GelDispense.Agent.Formats;
using GelDispense.Agent.Stability;
using Microsoft.Extensions.Time.Testing;

namespace GelDispense.Agent.Tests.Stability;

/// <summary>
/// Evaporation traces. An open beaker of ethanol losing a few mg per minute is common practice in a fume
/// hood; the rates below are synthetic, chosen around the 2 mg/min default threshold.
/// </summary>
public class DriftDetectionTests
{
    private static readonly TimeSpan Tick = TimeSpan.FromMilliseconds(100);
    private readonly FakeTimeProvider _time = new(new DateTimeOffset(2026, 3, 2, 9, 0, 0, TimeSpan.Zero));

    private List<StabilityVerdict> Trace(StabilityDetector detector, double startG, double slopeGPerMin, double noiseG, int count, int seed)
    {
        var random = new Random(seed);
        var verdicts = new List<StabilityVerdict>();
        for (var i = 0; i < count; i++)
        {
            _time.Advance(Tick);
            var value = startG + slopeGPerMin * (i * Tick.TotalMinutes) + noiseG * (random.NextDouble() - 0.5);
            verdicts.Add(detector.Add(new BalanceReading(Math.Round(value, 4), null, ReadingKind.Weight, "")));
        }

        return verdicts;
    }

    [Fact]
    public void Steady_evaporation_is_reported_as_drift_with_its_slope_while_still_inside_the_stability_band()
    {
        var detector = new StabilityDetector(new StabilitySettings(), _time);

        var verdicts = Trace(detector, 42.0, slopeGPerMin: -0.006, noiseG: 0.0002, count: 300, seed: 11);

        var last = verdicts[^1];
        Assert.True(last.Drifting);
        Assert.Equal(-0.006, last.Drift!.SlopeGPerMin, 3);
        // 6 mg/min is 0.1 mg/s: a 1 s window spans ~0.1 mg plus noise, inside the 0.5 mg band.
        Assert.True(last.IsStable);
    }

    [Fact]
    public void No_drift_is_claimed_before_the_drift_window_is_covered()
    {
        var detector = new StabilityDetector(new StabilitySettings { DriftWindow = TimeSpan.FromSeconds(20) }, _time);

        var verdicts = Trace(detector, 42.0, slopeGPerMin: -0.05, noiseG: 0.0, count: 199, seed: 1);

        Assert.All(verdicts, v => Assert.Null(v.Drift));
    }

    [Fact]
    public void Noise_alone_is_not_drift()
    {
        var detector = new StabilityDetector(new StabilitySettings(), _time);

        var verdicts = Trace(detector, 42.0, slopeGPerMin: 0.0, noiseG: 0.0004, count: 400, seed: 5);

        Assert.All(verdicts.Where(v => v.Drift is not null), v => Assert.False(v.Drifting));
        Assert.Contains(verdicts, v => v.Drift is not null);
    }

    [Fact]
    public void A_slope_below_the_threshold_is_not_drift()
    {
        var detector = new StabilityDetector(new StabilitySettings { DriftThresholdGPerMin = 0.002 }, _time);

        var last = Trace(detector, 42.0, slopeGPerMin: -0.001, noiseG: 0.0, count: 300, seed: 1)[^1];

        Assert.False(last.Drifting);
        Assert.Equal(-0.001, last.Drift!.SlopeGPerMin, 4);
    }

    [Fact]
    public void A_pour_restarts_the_drift_window_instead_of_counting_as_a_trend()
    {
        var detector = new StabilityDetector(new StabilitySettings(), _time);
        Trace(detector, 10.0, slopeGPerMin: 0.0, noiseG: 0.0, count: 250, seed: 1);

        var afterPour = Trace(detector, 15.0, slopeGPerMin: 0.0, noiseG: 0.0, count: 150, seed: 1);

        Assert.All(afterPour, v => Assert.Null(v.Drift));
    }
}
