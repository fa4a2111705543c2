using System.Net;
using System.Net.Sockets;
using System.Text;
using GelDispense.Agent.Links;
using GelDispense.Agent.Tests.Support;

namespace GelDispense.Agent.Tests.Links;

/// <summary>The TCP link against a real loopback listener.</summary>
public class TcpLinkTests
{
    [Fact]
    public async Task Lines_arrive_and_a_closed_socket_is_lost_then_reconnected()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        var port = ((IPEndPoint)listener.LocalEndpoint).Port;
        await using var link = FastLinks.Tcp(port);
        var status = new StatusLog(link);
        link.Start();

        using (var first = await listener.AcceptTcpClientAsync())
        {
            await first.GetStream().WriteAsync(Encoding.ASCII.GetBytes("\nmass=1.5,unit=g,steady=1\r\n"));
            Assert.Equal("mass=1.5,unit=g,steady=1", (await LineWaiter.TakeAsync(link, 1)).Single().Line.Text);
        }

        var lost = await status.WaitForAsync(LinkStatus.Lost);
        using var second = await listener.AcceptTcpClientAsync();
        await second.GetStream().WriteAsync(Encoding.ASCII.GetBytes("\nmass=2.5,unit=g,steady=1\n"));
        var again = (await LineWaiter.TakeAsync(link, 1)).Single();

        Assert.Contains("closed the connection", lost.Reason);
        Assert.Equal(2, again.ConnectionEpoch);
    }

    [Fact]
    public async Task A_network_balance_connection_arms_its_keep_alive_probe_within_seconds_not_hours()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        var port = ((IPEndPoint)listener.LocalEndpoint).Port;
        using var connection = new TcpConnector(new TcpLinkSettings { Host = "127.0.0.1", Port = port }).Open();
        using var peer = await listener.AcceptTcpClientAsync();

        // Linux proc(5), /proc/net/tcp and tcp6 (the client socket is dual-mode): the agent's end has the listener as
        // its remote address; "tr" 2 is the keep-alive timer and "tm->when" the time left on it in clock ticks
        // (USER_HZ, 100 a second). The system default would show about 7200 s.
        var row = new[] { "/proc/net/tcp", "/proc/net/tcp6" }.SelectMany(table => File.ReadLines(table).Skip(1))
            .Select(line => line.Split(' ', StringSplitOptions.RemoveEmptyEntries))
            .Single(fields => fields[2].EndsWith($":{port:X4}", StringComparison.Ordinal) && fields[3] == "01");
        var timer = row[5].Split(':');

        Assert.Equal("02", timer[0]);
        Assert.InRange(Convert.ToInt64(timer[1], 16) / 100.0, 0.0, 10.0);
    }

    [Fact]
    public async Task Nobody_listening_means_reconnecting_with_the_reason()
    {
        int port;
        using (var probe = new TcpListener(IPAddress.Loopback, 0))
        {
            probe.Start();
            port = ((IPEndPoint)probe.LocalEndpoint).Port;
        }

        await using var link = FastLinks.Tcp(port);
        var status = new StatusLog(link);
        link.Start();

        var retry = await status.WaitForAsync(LinkStatus.Reconnecting);

        Assert.Equal(1, retry.Attempt);
        Assert.False(await link.SendAsync("X", CancellationToken.None));
    }

    [Fact]
    public async Task A_balance_that_falls_silent_past_the_limit_is_treated_as_unplugged()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        var port = ((IPEndPoint)listener.LocalEndpoint).Port;
        var connector = new TcpConnector(new TcpLinkSettings { Host = "127.0.0.1", Port = port, ReadTimeout = TimeSpan.FromMilliseconds(50) });
        await using var link = new BalanceLink(connector, GelDispense.Agent.Formats.LineEnding.CrLf, 128, FastLinks.Reconnect with { SilenceLimit = TimeSpan.FromMilliseconds(300) }, TimeProvider.System);
        var status = new StatusLog(link);
        link.Start();
        using var quiet = await listener.AcceptTcpClientAsync();

        var lost = await status.WaitForAsync(LinkStatus.Lost);

        Assert.Equal("no data for 0.3 s", lost.Reason);
    }
}
