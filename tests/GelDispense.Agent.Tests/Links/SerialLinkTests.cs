using System.Text;
using GelDispense.Agent.Formats;
using GelDispense.Agent.Links;
using GelDispense.Agent.Pty;
using GelDispense.Agent.Tests.Support;

namespace GelDispense.Agent.Tests.Links;

/// <summary>The serial link over a real pseudo-terminal: SerialPort on the slave, our writes on the master.</summary>
public sealed class SerialLinkTests : TempDirectoryTest
{
    [Fact]
    public async Task Lines_arrive_split_and_in_order_with_mixed_endings_after_the_first_partial_line_is_dropped()
    {
        using var pty = PseudoTerminal.Open();
        await using var link = FastLinks.Serial(pty.SlavePath);
        var status = new StatusLog(link);
        link.Start();
        await status.WaitForAsync(LinkStatus.Connected);

        // The link cannot know it opened at a line start, so whatever precedes the first terminator goes.
        pty.Write("2.3450 g\r\n= +   12.3456 g\r\n~ +   12.3");
        pty.Write("461 g\n\xff= +   12.3462 g\r");

        var lines = await LineWaiter.TakeAsync(link, 3);

        Assert.Equal(["= +   12.3456 g", "~ +   12.3461 g", "= +   12.3462 g"], lines.Select(l => l.Line.Text));
        Assert.Equal([0, 0, 1], lines.Select(l => l.Line.NonTextBytes));
        Assert.All(lines, l => Assert.Equal(1, l.ConnectionEpoch));
    }

    [Fact]
    public async Task A_command_goes_out_with_the_configured_line_ending()
    {
        using var pty = PseudoTerminal.Open();
        await using var link = FastLinks.Serial(pty.SlavePath, LineEnding.Cr);
        var status = new StatusLog(link);
        link.Start();
        await status.WaitForAsync(LinkStatus.Connected);

        Assert.True(await link.SendAsync("ZERO!", CancellationToken.None));

        var received = new StringBuilder();
        var buffer = new byte[32];
        var deadline = DateTime.UtcNow.AddSeconds(5);
        while (received.Length < 6 && DateTime.UtcNow < deadline)
        {
            received.Append(Encoding.ASCII.GetString(buffer, 0, pty.Read(buffer, 50)));
        }

        Assert.Equal("ZERO!\r", received.ToString());
    }

    [Fact]
    public async Task A_missing_port_is_reported_by_name_and_retried_until_it_appears()
    {
        var path = Path.Combine(Dir, "balance");
        await using var link = FastLinks.Serial(path);
        var status = new StatusLog(link);
        link.Start();

        var retry = await status.WaitForAsync(LinkStatus.Reconnecting);
        Assert.Contains($"{path} does not exist", retry.Reason);

        using var pty = PseudoTerminal.Open();
        SymlinkPoint.Point(path, pty.SlavePath);
        await status.WaitForAsync(LinkStatus.Connected);
        pty.Write("\r\n= +    1.0000 g\r\n");

        Assert.Equal("= +    1.0000 g", (await LineWaiter.TakeAsync(link, 1)).Single().Line.Text);
    }

    [Fact]
    public async Task A_hang_up_mid_line_is_reported_lost_then_the_link_reopens_without_gluing_half_lines()
    {
        var path = Path.Combine(Dir, "balance");
        var first = PseudoTerminal.Open();
        SymlinkPoint.Point(path, first.SlavePath);
        await using var link = FastLinks.Serial(path);
        var status = new StatusLog(link);
        link.Start();
        await status.WaitForAsync(LinkStatus.Connected);

        first.Write("\r\n= +   12.3456 g\r\n= +   12.34");
        Assert.Equal("= +   12.3456 g", (await LineWaiter.TakeAsync(link, 1)).Single().Line.Text);
        var before = status.Changes.Count;
        using var second = PseudoTerminal.Open();
        SymlinkPoint.Point(path, second.SlavePath);
        first.HangUp();

        var lost = await status.WaitForAsync(LinkStatus.Lost, before);
        await status.WaitForAsync(LinkStatus.Connected, before);
        second.Write("56 g\r\n= +   20.0000 g\r\n");
        var after = (await LineWaiter.TakeAsync(link, 1)).Single();

        // The hang-up surfaces as ObjectDisposedException from Read while IsOpen still says true.
        Assert.Contains("ObjectDisposedException", lost.Reason);
        Assert.Equal("= +   20.0000 g", after.Line.Text);
        Assert.Equal(2, after.ConnectionEpoch);
        Assert.Equal(20.0, new LineParser(BuiltInFormats.Column).Parse(after.Line).Reading!.ValueG);
    }
}
