using System.Net.Sockets;

namespace GelDispense.Agent.Links;

/// <summary>
/// An open socket. Waiting uses Poll rather than ReceiveTimeout, so a quiet balance is "nothing yet" without
/// an exception, and a zero-byte receive is the peer closing: a lost line.
/// </summary>
internal sealed class TcpConnection(TcpClient client, TimeSpan readTimeout) : IBalanceConnection
{
    public int Read(Span<byte> buffer)
    {
        var socket = client.Client;
        if (!socket.Poll(readTimeout, SelectMode.SelectRead))
        {
            return 0;
        }

        var n = socket.Receive(buffer);
        return n > 0 ? n : throw new IOException("the balance closed the connection");
    }

    public void Write(ReadOnlySpan<byte> data) => client.Client.Send(data);

    public void Dispose() => client.Dispose();
}
