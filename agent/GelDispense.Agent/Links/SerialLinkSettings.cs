using System.IO.Ports;

namespace GelDispense.Agent.Links;

/// <summary>
/// A serial port by path (on Linux <c>SerialPort.GetPortNames()</c> lists nothing, so the path is configured):
/// <c>/dev/ttyUSB0</c>, <c>/dev/serial/by-id/…</c> or a pseudo-terminal. Defaults are 9600 8N1, no handshake,
/// the most common balance setting (common practice). WriteTimeout is never infinite: on a hung-up line an
/// unbounded write blocks forever.
/// </summary>
public sealed record SerialLinkSettings
{
    public required string PortPath { get; init; }

    public int BaudRate { get; init; } = 9600;

    public Parity Parity { get; init; } = Parity.None;

    public int DataBits { get; init; } = 8;

    public StopBits StopBits { get; init; } = StopBits.One;

    public Handshake Handshake { get; init; } = Handshake.None;

    public TimeSpan ReadTimeout { get; init; } = TimeSpan.FromMilliseconds(500);

    public TimeSpan WriteTimeout { get; init; } = TimeSpan.FromSeconds(1);

    public TimeSpan CloseTimeout { get; init; } = TimeSpan.FromSeconds(2);
}
