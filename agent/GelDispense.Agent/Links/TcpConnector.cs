using System.Net.Sockets;

namespace GelDispense.Agent.Links;

/// <summary>Connects to host:port with a bounded connect time.</summary>
public sealed class TcpConnector(TcpLinkSettings settings) : IBalanceConnector
{
    public string Describe => $"tcp://{settings.Host}:{settings.Port}";

    public IBalanceConnection Open()
    {
        var client = new TcpClient { NoDelay = true, SendTimeout = (int)settings.WriteTimeout.TotalMilliseconds };
        try
        {
            using var timeout = new CancellationTokenSource(settings.ConnectTimeout);
            client.ConnectAsync(settings.Host, settings.Port, timeout.Token).AsTask().GetAwaiter().GetResult();
            var socket = client.Client;
            socket.SetSocketOption(SocketOptionLevel.Socket, SocketOptionName.KeepAlive, true);
            socket.SetSocketOption(SocketOptionLevel.Tcp, SocketOptionName.TcpKeepAliveTime, (int)settings.KeepAliveIdle.TotalSeconds);
            socket.SetSocketOption(SocketOptionLevel.Tcp, SocketOptionName.TcpKeepAliveInterval, (int)settings.KeepAliveInterval.TotalSeconds);
            socket.SetSocketOption(SocketOptionLevel.Tcp, SocketOptionName.TcpKeepAliveRetryCount, settings.KeepAliveProbes);
            return new TcpConnection(client, settings.ReadTimeout);
        }
        catch (OperationCanceledException)
        {
            client.Dispose();
            throw new IOException($"no connection to {settings.Host}:{settings.Port} within {settings.ConnectTimeout.TotalSeconds:0.#} s");
        }
        catch
        {
            client.Dispose();
            throw;
        }
    }
}
