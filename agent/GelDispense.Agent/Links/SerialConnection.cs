using System.IO.Ports;

namespace GelDispense.Agent.Links;

/// <summary>
/// An open serial port. A read timeout is "nothing yet"; anything else (ObjectDisposedException after a
/// hang-up while IsOpen still says true, IOException from an unplugged adapter) propagates as a lost line.
/// </summary>
internal sealed class SerialConnection(SerialPort port, TimeSpan closeTimeout) : IBalanceConnection
{
    private readonly byte[] _readBuffer = new byte[4096];

    public int Read(Span<byte> buffer)
    {
        try
        {
            var n = port.Read(_readBuffer, 0, Math.Min(buffer.Length, _readBuffer.Length));
            _readBuffer.AsSpan(0, n).CopyTo(buffer);
            return n;
        }
        catch (TimeoutException)
        {
            return 0;
        }
    }

    public void Write(ReadOnlySpan<byte> data) => port.Write(data.ToArray(), 0, data.Length);

    public void Dispose() => BoundedClose.Run(port.Dispose, closeTimeout);
}
