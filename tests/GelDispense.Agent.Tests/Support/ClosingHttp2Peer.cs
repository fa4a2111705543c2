using System.Buffers.Binary;
using System.Net;
using System.Net.Sockets;

namespace GelDispense.Agent.Tests.Support;

/// <summary>
/// A loopback peer speaking just enough HTTP/2 (RFC 9113) to take a call and then go away the way a service does
/// when it shuts down: it answers the connection preface and settings, and on the first request's HEADERS frame
/// sends GOAWAY (NO_ERROR, that stream as the last one it took) and closes the connection without answering.
/// </summary>
public sealed class ClosingHttp2Peer : IAsyncDisposable
{
    private const byte Settings = 0x4;
    private const byte Headers = 0x1;
    private const byte GoAway = 0x7;
    private const byte Ack = 0x1;
    private static readonly byte[] ClientPreface = "PRI * HTTP/2.0\r\n\r\nSM\r\n\r\n"u8.ToArray();

    private readonly TcpListener _listener = new(IPAddress.Loopback, 0);
    private readonly CancellationTokenSource _stop = new();
    private readonly Task _accepting;
    private int _callsTaken;

    public ClosingHttp2Peer()
    {
        _listener.Start();
        _accepting = AcceptAsync(_stop.Token);
    }

    public Uri Address => new($"http://127.0.0.1:{((IPEndPoint)_listener.LocalEndpoint).Port}");

    /// <summary>Requests whose HEADERS arrived before the connection was closed under them.</summary>
    public int CallsTaken => Volatile.Read(ref _callsTaken);

    public async ValueTask DisposeAsync()
    {
        await _stop.CancelAsync();
        _listener.Stop();
        try
        {
            await _accepting;
        }
        catch (OperationCanceledException)
        {
        }
        catch (SocketException)
        {
        }

        _stop.Dispose();
    }

    private async Task AcceptAsync(CancellationToken cancellationToken)
    {
        while (!cancellationToken.IsCancellationRequested)
        {
            using var client = await _listener.AcceptTcpClientAsync(cancellationToken);
            try
            {
                await TakeOneCallAsync(client.GetStream(), cancellationToken);
            }
            catch (Exception e) when (e is IOException or SocketException)
            {
                // The client gave up on this connection first; wait for the next one.
            }
        }
    }

    private async Task TakeOneCallAsync(NetworkStream stream, CancellationToken cancellationToken)
    {
        await stream.ReadExactlyAsync(new byte[ClientPreface.Length], cancellationToken);
        await WriteFrameAsync(stream, Settings, 0, 0, [], cancellationToken);
        var header = new byte[9];
        while (true)
        {
            await stream.ReadExactlyAsync(header, cancellationToken);
            var length = (header[0] << 16) | (header[1] << 8) | header[2];
            var (type, flags) = (header[3], header[4]);
            var streamId = BinaryPrimitives.ReadInt32BigEndian(header.AsSpan(5)) & int.MaxValue;
            await stream.ReadExactlyAsync(new byte[length], cancellationToken);
            if (type == Settings && (flags & Ack) == 0)
            {
                await WriteFrameAsync(stream, Settings, Ack, 0, [], cancellationToken);
            }
            else if (type == Headers)
            {
                Interlocked.Increment(ref _callsTaken);
                var payload = new byte[8];
                BinaryPrimitives.WriteInt32BigEndian(payload, streamId);
                await WriteFrameAsync(stream, GoAway, 0, 0, payload, cancellationToken);
                stream.Socket.Shutdown(SocketShutdown.Send);
                return;
            }
        }
    }

    private static async Task WriteFrameAsync(NetworkStream stream, byte type, byte flags, int streamId, byte[] payload, CancellationToken cancellationToken)
    {
        var frame = new byte[9 + payload.Length];
        (frame[0], frame[1], frame[2]) = ((byte)(payload.Length >> 16), (byte)(payload.Length >> 8), (byte)payload.Length);
        (frame[3], frame[4]) = (type, flags);
        BinaryPrimitives.WriteInt32BigEndian(frame.AsSpan(5), streamId);
        payload.CopyTo(frame, 9);
        await stream.WriteAsync(frame, cancellationToken);
    }
}
