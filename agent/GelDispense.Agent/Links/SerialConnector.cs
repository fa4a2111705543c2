using System.IO.Ports;

namespace GelDispense.Agent.Links;

/// <summary>Opens a <see cref="SerialPort"/> by path with every setting explicit, timeouts included.</summary>
public sealed class SerialConnector(SerialLinkSettings settings) : IBalanceConnector
{
    public string Describe => $"{settings.PortPath} {settings.BaudRate} {settings.DataBits}{ParityLetter(settings.Parity)}{StopBitsText(settings.StopBits)}";

    public IBalanceConnection Open()
    {
        // Without these checks a missing device reads as "access denied", which sends people after permissions.
        var info = new FileInfo(settings.PortPath);
        if (!info.Exists && info.LinkTarget is null)
        {
            throw new IOException($"serial port {settings.PortPath} does not exist");
        }

        if (info.LinkTarget is { } target && info.ResolveLinkTarget(returnFinalTarget: true) is { Exists: false })
        {
            throw new IOException($"serial port {settings.PortPath} points to {target}, which does not exist (adapter unplugged?)");
        }

        var port = new SerialPort(settings.PortPath, settings.BaudRate, settings.Parity, settings.DataBits, settings.StopBits)
        {
            Handshake = settings.Handshake,
            ReadTimeout = (int)settings.ReadTimeout.TotalMilliseconds,
            WriteTimeout = (int)settings.WriteTimeout.TotalMilliseconds,
        };
        try
        {
            port.Open();

            // Bytes queued before we opened belong to no reading we can date; start clean.
            port.DiscardInBuffer();
            return new SerialConnection(port, settings.CloseTimeout);
        }
        catch
        {
            BoundedClose.Run(port.Dispose, settings.CloseTimeout);
            throw;
        }
    }

    private static char ParityLetter(Parity parity) => parity switch
    {
        Parity.Even => 'E',
        Parity.Odd => 'O',
        Parity.Mark => 'M',
        Parity.Space => 'S',
        _ => 'N',
    };

    private static string StopBitsText(StopBits stopBits) => stopBits switch
    {
        StopBits.OnePointFive => "1.5",
        StopBits.Two => "2",
        _ => "1",
    };
}
