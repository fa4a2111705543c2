using GelDispense.Agent.Formats;
using GelDispense.Agent.Links;
using GelDispense.Agent.Readings;
using GelDispense.Agent.Simulation;
using GelDispense.Agent.Stability;
using GelDispense.Agent.Tests.Support;

namespace GelDispense.Agent.Tests.Simulation;

/// <summary>The simulator on a real pseudo-terminal, read back through the serial link, parsed and judged.</summary>
public sealed class SimulatorOverPtyTests : TempDirectoryTest
{
    private static SimulatorHost Host(SimulatorSettings settings, ITechnician technician, ISimulatorPort port, LineFormat format) =>
        new(new BalanceSimulator(settings, technician, new Random(17)), new SampleRenderer(format, settings.ReadabilityG, new Random(18)), port, settings, TimeProvider.System);

    [Fact]
    public async Task A_simulated_pour_reads_back_as_a_confirmable_reading_of_the_poured_mass()
    {
        var settings = new SimulatorSettings { SampleInterval = TimeSpan.FromMilliseconds(20), SettlingTimeConstant = TimeSpan.FromMilliseconds(150), GarbageProbability = 0.05 };
        var technician = new ScriptedTechnician([new PourStep(4.0, OverPourFraction: 0.05)], new TechnicianPace { PauseBetweenSteps = TimeSpan.FromMilliseconds(200), FastGPerS = 20, SlowGPerS = 5 });
        using var port = new PtySimulatorPort(Path.Combine(Dir, "balance"));
        using var stop = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        var hosting = Host(settings, technician, port, BuiltInFormats.Column).RunAsync(null, stop.Token);
        await using var link = FastLinks.Serial(port.SlavePath);
        var stream = new BalanceReadingStream(link, new LineParser(BuiltInFormats.Column), new StabilityDetector(new StabilitySettings(), TimeProvider.System));
        link.Start();

        StabilityVerdict? confirmed = null;
        await foreach (var e in stream.ReadAsync(stop.Token))
        {
            if (e.Verdict is { Confirmable: true, Reading.ValueG: > 4.0 } verdict)
            {
                confirmed = verdict;
                break;
            }
        }

        await stop.CancelAsync();
        await Assert.ThrowsAnyAsync<OperationCanceledException>(() => hosting);
        Assert.Equal(4.2, confirmed!.Reading.ValueG!.Value, 3);
        Assert.Equal(StabilityBasis.BalanceFlag, confirmed.Basis);
    }

    [Fact]
    public async Task A_simulated_disconnect_is_seen_as_lost_and_the_link_comes_back_on_the_same_path()
    {
        var settings = new SimulatorSettings { SampleInterval = TimeSpan.FromMilliseconds(20), DisconnectEvery = TimeSpan.FromMilliseconds(600), DisconnectFor = TimeSpan.FromMilliseconds(300) };
        var path = Path.Combine(Dir, "balance");
        using var port = new PtySimulatorPort(path);
        using var stop = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        var hosting = Host(settings, new ScriptedTechnician([], new TechnicianPace()), port, BuiltInFormats.Keyed).RunAsync(null, stop.Token);
        await using var link = FastLinks.Serial(path);
        var status = new StatusLog(link);
        link.Start();

        await WhileServing(hosting, status.WaitForAsync(LinkStatus.Lost, seconds: 15));
        var afterLoss = status.Changes.Count;
        await WhileServing(hosting, status.WaitForAsync(LinkStatus.Connected, afterLoss, seconds: 15));
        var parser = new LineParser(BuiltInFormats.Keyed);
        ReceivedLine? readingAfterReconnect = null;
        await foreach (var line in link.ReadLinesAsync(stop.Token))
        {
            if (line.ConnectionEpoch >= 2 && parser.Parse(line.Line).IsReading)
            {
                readingAfterReconnect = line;
                break;
            }
        }

        await stop.CancelAsync();
        await Assert.ThrowsAnyAsync<OperationCanceledException>(() => hosting);
        Assert.NotNull(readingAfterReconnect);
    }

    [Fact]
    public async Task Every_disconnect_of_many_simulated_balances_at_once_is_seen_as_lost()
    {
        // SerialPort misses the odd hang-up when several ports are cut at once (here about 1 in 50 with eight
        // balances); the link must see each one through its own check.
        const int Balances = 8, LossesEach = 5;
        var settings = new SimulatorSettings { SampleInterval = TimeSpan.FromMilliseconds(20), DisconnectEvery = TimeSpan.FromMilliseconds(400), DisconnectFor = TimeSpan.FromMilliseconds(150) };
        var missed = await Task.WhenAll(Enumerable.Range(0, Balances).Select(i => Task.Run(async () =>
        {
            var path = Path.Combine(Dir, $"balance-{i}");
            using var port = new PtySimulatorPort(path);
            using var stop = new CancellationTokenSource();
            var hosting = Host(settings, new ScriptedTechnician([], new TechnicianPace()), port, BuiltInFormats.Keyed).RunAsync(null, stop.Token);
            await using var link = FastLinks.Serial(path);
            var status = new StatusLog(link);
            link.Start();
            string? failure = null;
            for (var loss = 1; loss <= LossesEach && failure is null; loss++)
            {
                try
                {
                    await WhileServing(hosting, status.WaitForCountAsync(LinkStatus.Lost, loss, seconds: 5));
                }
                catch (TimeoutException e)
                {
                    failure = $"balance {i}, loss {loss}: {e.Message}";
                }
            }

            await stop.CancelAsync();
            await Assert.ThrowsAnyAsync<OperationCanceledException>(() => hosting);
            return failure;
        })));

        Assert.Empty(missed.OfType<string>());
    }

    /// <summary>Waits for <paramref name="wait"/>, failing with the simulator's own error if it stops serving first.</summary>
    private static async Task WhileServing(Task hosting, Task wait)
    {
        if (await Task.WhenAny(wait, hosting) == hosting)
        {
            await hosting;
            Assert.Fail("the simulator stopped serving before the link saw what the test waits for");
        }

        await wait;
    }
}
