using GelDispense.Agent.Formats;
using GelDispense.Agent.Links;
using GelDispense.Agent.Pty;
using GelDispense.Agent.Readings;
using GelDispense.Agent.Stability;
using GelDispense.Agent.Tests.Support;

namespace GelDispense.Agent.Tests.Readings;

/// <summary>Link, codec and stability together over a real pseudo-terminal, including a pulled cable.</summary>
public sealed class BalanceReadingStreamTests : TempDirectoryTest
{
    [Fact]
    public async Task After_a_hang_up_no_reading_is_stable_until_it_has_earned_a_new_window()
    {
        var path = Path.Combine(Dir, "balance");
        var first = PseudoTerminal.Open();
        SymlinkPoint.Point(path, first.SlavePath);
        await using var link = FastLinks.Serial(path, LineEnding.Lf);
        var status = new StatusLog(link);
        var settings = new StabilitySettings { Mode = StabilityMode.Software, MinReadings = 3, Window = TimeSpan.FromMilliseconds(200) };
        var stream = new BalanceReadingStream(link, new LineParser(BuiltInFormats.Bare), new StabilityDetector(settings, TimeProvider.System));
        link.Start();
        await status.WaitForAsync(LinkStatus.Connected);
        first.Write("\n");
        using var cancel = new CancellationTokenSource(TimeSpan.FromSeconds(20));
        var events = stream.ReadAsync(cancel.Token).GetAsyncEnumerator(cancel.Token);

        // Earn stability on the first connection: steady readings every 20 ms for well over the window.
        var stableBefore = false;
        for (var i = 0; i < 40 && !stableBefore; i++)
        {
            first.Write("25.0000\n");
            Assert.True(await events.MoveNextAsync());
            stableBefore = events.Current.Verdict!.Confirmable;
            await Task.Delay(20);
        }

        Assert.True(stableBefore);
        var before = status.Changes.Count;
        using var second = PseudoTerminal.Open();
        SymlinkPoint.Point(path, second.SlavePath);
        first.Write("25.00");
        first.HangUp();
        await status.WaitForAsync(LinkStatus.Connected, before);

        // "00" is the tail of the line cut by the hang-up; alone it would parse as 0 g.
        second.Write("00\n25.0000\n");
        Assert.True(await events.MoveNextAsync());
        var firstAfter = events.Current;

        Assert.Equal(25.0, firstAfter.Parse.Reading!.ValueG);
        Assert.Equal(2, firstAfter.Line.ConnectionEpoch);
        Assert.False(firstAfter.Verdict!.Confirmable);
        Assert.Equal(1, stream.Counters.Reconnects);
        Assert.Equal(0, stream.Counters.Garbage);
        await events.DisposeAsync();
    }
}
