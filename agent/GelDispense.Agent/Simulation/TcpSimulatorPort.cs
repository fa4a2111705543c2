using System.Net;
using System.Net.Sockets;

namespace GelDispense.Agent.Simulation;

/// <summary>Serves on a loopback TCP port, one client at a time (a serial-to-network adapter behaves so).</summary>
public sealed class TcpSimulatorPort : ISimulatorPort
{
    private readonly TcpListener _listener;
    private Socket? _client;
    private bool _down;

    public TcpSimulatorPort(int port)
    {
        _listener = new TcpListener(IPAddress.Loopback, port);
        _listener.Start();
        Port = ((IPEndPoint)_listener.LocalEndpoint).Port;
    }

    public int Port { get; }

    public string Describe => $"127.0.0.1:{Port}";

    public void Send(ReadOnlySpan<byte> line)
    {
        if (Client() is not { } client)
        {
            return;
        }

        try
        {
            client.Send(line);
        }
        catch (SocketException)
        {
            Drop();
        }
    }

    public int Receive(Span<byte> buffer)
    {
        if (Client() is not { } client || client.Available == 0)
        {
            return 0;
        }

        try
        {
            return client.Receive(buffer);
        }
        catch (SocketException)
        {
            Drop();
            return 0;
        }
    }

    public void Disconnect()
    {
        _down = true;
        Drop();
    }

    public void Reconnect() => _down = false;

    public void Dispose()
    {
        Drop();
        _listener.Dispose();
    }

    private Socket? Client()
    {
        if (_client is null && !_down && _listener.Pending())
        {
            _client = _listener.AcceptSocket();
            _client.NoDelay = true;
        }

        // A client that connected while the line was down is turned away, as a dead adapter would.
        if (_down && _listener.Pending())
        {
            _listener.AcceptSocket().Dispose();
        }

        return _client;
    }

    private void Drop()
    {
        _client?.Dispose();
        _client = null;
    }
}
