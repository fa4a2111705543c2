using System.Net.Sockets;
using System.Text;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>A bare TCP connection for the tests that must misbehave as a client library never would: stall mid-request, idle.</summary>
public sealed class RawSocket : IDisposable
{
    private readonly TcpClient _client = new();

    private RawSocket()
    {
    }

    public static async Task<RawSocket> OpenAsync(int port)
    {
        var connection = new RawSocket();
        await connection._client.ConnectAsync("127.0.0.1", port);
        return connection;
    }

    public Task SendAsync(string ascii) => _client.GetStream().WriteAsync(Encoding.ASCII.GetBytes(ascii)).AsTask();

    /// <summary>
    /// Reads until the server closes the connection (end of stream or reset) or <paramref name="bound"/> passes.
    /// Returns what the server sent, and whether it closed within the bound.
    /// </summary>
    public async Task<(string Received, bool Closed)> ReadUntilClosedAsync(TimeSpan bound)
    {
        using var deadline = new CancellationTokenSource(bound);
        var received = new StringBuilder();
        var buffer = new byte[4096];
        try
        {
            while (true)
            {
                var read = await _client.GetStream().ReadAsync(buffer, deadline.Token);
                if (read == 0)
                {
                    return (received.ToString(), true);
                }

                received.Append(Encoding.ASCII.GetString(buffer, 0, read));
            }
        }
        catch (OperationCanceledException)
        {
            return (received.ToString(), false);
        }
        catch (IOException)
        {
            return (received.ToString(), true);
        }
    }

    public void Dispose() => _client.Dispose();
}
