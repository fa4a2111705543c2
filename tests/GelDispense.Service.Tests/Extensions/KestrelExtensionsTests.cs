using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Extensions;

/// <summary>
/// The connection limits of the Limits section, on real sockets against the REST endpoint, set to one second so
/// each test ends within a few. Kestrel checks them on its one-second heartbeat; the bound of 8 s is generous
/// and still well below the defaults (10 s headers, 120 s keep-alive), so a limit that was not applied fails.
/// </summary>
public sealed class KestrelExtensionsTests
{
    private static readonly TimeSpan Bound = TimeSpan.FromSeconds(8);

    [Fact]
    public async Task A_client_that_stalls_halfway_through_its_headers_is_cut_off_after_the_configured_headers_timeout()
    {
        await using var host = await KestrelHost.StartAsync(new Dictionary<string, string> { ["Limits:RequestHeadersTimeoutSeconds"] = "1" });
        using var connection = await RawSocket.OpenAsync(host.RestPort);
        await connection.SendAsync("GET /healthz HTTP/1.1\r\nHost: 127.0.0.1\r\nAccept: ");

        var (received, closed) = await connection.ReadUntilClosedAsync(Bound);

        Assert.True(closed, "the connection was still open after 8 s");
        // RFC 9110 §15.5.9: 408 Request Timeout, or no answer at all, are both fair to a client that never finished.
        Assert.True(received.Length == 0 || received.StartsWith("HTTP/1.1 408", StringComparison.Ordinal), received);
    }

    [Fact]
    public async Task An_idle_keep_alive_connection_is_closed_after_the_configured_keep_alive_timeout()
    {
        await using var host = await KestrelHost.StartAsync(new Dictionary<string, string> { ["Limits:KeepAliveTimeoutSeconds"] = "1" });
        using var connection = await RawSocket.OpenAsync(host.RestPort);
        await connection.SendAsync("GET /healthz HTTP/1.1\r\nHost: 127.0.0.1\r\n\r\n");

        var (received, closed) = await connection.ReadUntilClosedAsync(Bound);

        Assert.StartsWith("HTTP/1.1 200", received, StringComparison.Ordinal);
        Assert.True(closed, "the idle connection was still open after 8 s");
    }

    [Fact]
    public async Task A_request_body_that_trickles_below_the_minimum_rate_is_cut_off_after_the_grace_period_without_a_server_error()
    {
        await using var host = await KestrelHost.StartAsync(new Dictionary<string, string>
        {
            ["Limits:MinRequestBodyBytesPerSecond"] = "240",
            ["Limits:MinRequestBodyGraceSeconds"] = "1.5",
        });
        using var connection = await RawSocket.OpenAsync(host.RestPort);
        await connection.SendAsync(
            "POST /v1/ping HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\nContent-Length: 4000\r\n\r\n{");

        var (received, closed) = await connection.ReadUntilClosedAsync(Bound);

        Assert.True(closed, "the connection was still open after 8 s");
        Assert.True(received.Length == 0 || received.StartsWith("HTTP/1.1 408", StringComparison.Ordinal), received);
    }
}
