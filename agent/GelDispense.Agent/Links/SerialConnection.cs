using System.IO.Ports;

namespace GelDispense.Agent.Links;

/// <summary>
/// An open serial port. A read timeout is "nothing yet" while the device still answers; anything else
/// (ObjectDisposedException after a hang-up while IsOpen still says true, IOException from an unplugged adapter)
/// propagates as a lost line.
/// </summary>
/// <remarks>
/// SerialPort does not always report a hang-up: with eight pseudo-terminals hung up at once, about one hang-up in
/// fifty left the port timing out every later read instead of failing, so a pulled cable looked like a quiet balance
/// for ever (a race somewhere inside SerialPort; a single port on an idle machine never showed it). After each timeout
/// the input queue is therefore asked for its length, an ioctl that a hung-up or unplugged tty refuses.
/// </remarks>
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
            return port.BytesToRead >= 0 ? 0 : throw new IOException($"{port.PortName} no longer answers (hung up or unplugged)");
        }
    }

    public void Write(ReadOnlySpan<byte> data) => port.Write(data.ToArray(), 0, data.Length);

    public void Dispose() => BoundedClose.Run(port.Dispose, closeTimeout);
}
