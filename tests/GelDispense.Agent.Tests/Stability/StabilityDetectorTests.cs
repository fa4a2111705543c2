using GelDispense.Agent.Formats;
using GelDispense.Agent.Stability;
using Microsoft.Extensions.Time.Testing;

namespace GelDispense.Agent.Tests.Stability;

/// <summary>
/// Synthetic traces at 10 readings per second on a 0.1 mg balance (a common analytical readability,
/// common practice), judged with a fake clock so every run sees the same times.
/// </summary>
public class StabilityDetectorTests
{
    private static readonly TimeSpan Tick = TimeSpan.FromMilliseconds(100);
    private readonly FakeTimeProvider _time = new(new DateTimeOffset(2026, 3, 2, 9, 0, 0, TimeSpan.Zero));

    private static BalanceReading Weight(double valueG, bool? stable = null) =>
        new(valueG, stable, ReadingKind.Weight, valueG.ToString("F4", System.Globalization.CultureInfo.InvariantCulture));

    private List<StabilityVerdict> Feed(StabilityDetector detector, IEnumerable<BalanceReading> trace)
    {
        var verdicts = new List<StabilityVerdict>();
        foreach (var reading in trace)
        {
            _time.Advance(Tick);
            verdicts.Add(detector.Add(reading));
        }

        return verdicts;
    }

    /// <summary>First-order approach to <paramref name="finalG"/> with time constant tau, plus seeded noise.</summary>
    private static IEnumerable<BalanceReading> Settling(double startG, double finalG, double tauS, double noiseG, int count, int seed)
    {
        var random = new Random(seed);
        for (var i = 0; i < count; i++)
        {
            var t = i * Tick.TotalSeconds;
            var value = finalG + (startG - finalG) * Math.Exp(-t / tauS) + noiseG * (random.NextDouble() - 0.5);
            yield return Weight(Math.Round(value, 4));
        }
    }

    [Fact]
    public void A_settling_pour_becomes_stable_only_after_it_has_settled_and_the_window_is_covered()
    {
        var detector = new StabilityDetector(new StabilitySettings { Mode = StabilityMode.Software }, _time);

        var verdicts = Feed(detector, Settling(10.0, 15.0, tauS: 0.5, noiseG: 0.0002, count: 60, seed: 7));

        var firstStable = verdicts.FindIndex(v => v.IsStable);
        // Residual exp(-t/tau)·5 g falls below the 0.5 mg band near t = tau·ln(1e4) ≈ 4.6 s, i.e. reading ~46;
        // plus the 1 s window to fill.
        Assert.InRange(firstStable, 46, 58);
        Assert.All(verdicts.Take(firstStable), v => Assert.False(v.Confirmable));
        Assert.All(verdicts.Skip(firstStable), v => Assert.True(v.Confirmable));
        Assert.All(verdicts, v => Assert.Equal(StabilityBasis.Software, v.Basis));
    }

    [Fact]
    public void Quick_readings_are_not_stable_until_the_whole_window_has_been_observed()
    {
        var detector = new StabilityDetector(new StabilitySettings { MinReadings = 3, Window = TimeSpan.FromSeconds(1) }, _time);

        var verdicts = Feed(detector, Enumerable.Repeat(Weight(5.0), 12));

        // Readings at 0.1 s ... 1.2 s after the first: the window is covered from the 11th reading on.
        Assert.Equal(Enumerable.Range(0, 12).Select(i => i >= 10), verdicts.Select(v => v.IsStable));
    }

    [Fact]
    public void Too_few_readings_in_the_window_are_never_stable()
    {
        var detector = new StabilityDetector(new StabilitySettings { MinReadings = 5, Window = TimeSpan.FromSeconds(1) }, _time);
        var verdicts = new List<StabilityVerdict>();
        for (var i = 0; i < 20; i++)
        {
            // A slow balance: one line every 0.4 s gives at most three readings per 1 s window.
            _time.Advance(TimeSpan.FromMilliseconds(400));
            verdicts.Add(detector.Add(Weight(5.0)));
        }

        Assert.DoesNotContain(verdicts, v => v.IsStable);
    }

    [Fact]
    public void A_spread_just_wider_than_the_band_is_not_stable()
    {
        var detector = new StabilityDetector(new StabilitySettings { BandG = 0.0005 }, _time);

        var verdicts = Feed(detector, Enumerable.Range(0, 30).Select(i => Weight(i % 2 == 0 ? 5.0 : 5.0006)));

        Assert.DoesNotContain(verdicts, v => v.IsStable);
    }

    [Fact]
    public void The_balance_flag_decides_in_auto_mode_when_the_line_has_one()
    {
        var detector = new StabilityDetector(new StabilitySettings(), _time);

        var verdicts = Feed(detector, [Weight(5.0, stable: true), Weight(5.3, stable: false), Weight(5.3, stable: true)]);

        Assert.Equal([true, false, true], verdicts.Select(v => v.IsStable));
        Assert.All(verdicts, v => Assert.Equal(StabilityBasis.BalanceFlag, v.Basis));
    }

    [Fact]
    public void Balance_flag_mode_never_trusts_a_line_without_a_flag()
    {
        var detector = new StabilityDetector(new StabilitySettings { Mode = StabilityMode.BalanceFlag }, _time);

        var verdicts = Feed(detector, Enumerable.Repeat(Weight(5.0), 30));

        Assert.DoesNotContain(verdicts, v => v.IsStable);
    }

    [Theory]
    [InlineData(ReadingKind.Overload)]
    [InlineData(ReadingKind.Underload)]
    [InlineData(ReadingKind.Error)]
    public void Markers_are_never_confirmable_and_restart_the_software_window(ReadingKind kind)
    {
        var detector = new StabilityDetector(new StabilitySettings { Mode = StabilityMode.Software }, _time);
        Feed(detector, Enumerable.Repeat(Weight(5.0), 20));

        var marker = Feed(detector, [BalanceReading.Marker(kind, "marker")]).Single();
        var after = Feed(detector, Enumerable.Repeat(Weight(5.0), 5));

        Assert.False(marker.Confirmable);
        Assert.Equal(StabilityBasis.NoMass, marker.Basis);
        Assert.DoesNotContain(after, v => v.IsStable);
    }

    [Fact]
    public void A_reading_flagged_moving_is_never_confirmable()
    {
        var detector = new StabilityDetector(new StabilitySettings(), _time);

        var verdicts = Feed(detector, Enumerable.Repeat(Weight(5.0, stable: false), 30));

        Assert.DoesNotContain(verdicts, v => v.Confirmable);
    }

    [Fact]
    public void Reset_forgets_readings_from_before_a_reconnect()
    {
        var detector = new StabilityDetector(new StabilitySettings { Mode = StabilityMode.Software }, _time);
        Assert.True(Feed(detector, Enumerable.Repeat(Weight(5.0), 20)).Last().IsStable);

        detector.Reset();

        Assert.DoesNotContain(Feed(detector, Enumerable.Repeat(Weight(5.0), 9)), v => v.IsStable);
    }
}
