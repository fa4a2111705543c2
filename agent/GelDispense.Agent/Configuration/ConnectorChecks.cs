using System.IO.Ports;
using GelDispense.Agent.Links;

namespace GelDispense.Agent.Configuration;

/// <summary>Checks the serial or TCP part of a balance config and builds its connector.</summary>
internal static class ConnectorChecks
{
    public static IBalanceConnector? Resolve(BalanceConfig balance, ErrorList errors)
    {
        if (string.IsNullOrWhiteSpace(balance.Port) == string.IsNullOrWhiteSpace(balance.Tcp))
        {
            errors.Add("balance.port", balance.Port ?? "", "set exactly one of balance.port (a serial device path) or balance.tcp (host:port)");
            return null;
        }

        return balance.Tcp is { Length: > 0 } tcp ? Tcp(tcp, balance.Serial, errors) : Serial(balance.Port!, balance.Serial, errors);
    }

    private static TcpConnector? Tcp(string address, SerialConfig timeouts, ErrorList errors)
    {
        var colon = address.LastIndexOf(':');
        if (colon <= 0 || !int.TryParse(address.AsSpan(colon + 1), out var port) || port is < 1 or > 65535)
        {
            errors.Add("balance.tcp", address, "use host:port with a port from 1 to 65535");
            return null;
        }

        return new TcpConnector(new TcpLinkSettings
        {
            Host = address[..colon],
            Port = port,
            ReadTimeout = TimeSpan.FromMilliseconds(timeouts.ReadTimeoutMs),
            WriteTimeout = TimeSpan.FromMilliseconds(timeouts.WriteTimeoutMs),
        });
    }

    private static SerialConnector? Serial(string path, SerialConfig s, ErrorList errors)
    {
        errors.Require(s.Baud is >= 110 and <= 4_000_000, "balance.serial.baud", s.Baud, "must be a baud rate from 110 to 4000000");
        errors.Require(s.DataBits is >= 5 and <= 8, "balance.serial.dataBits", s.DataBits, "must be 5, 6, 7 or 8");
        errors.Require(s.ReadTimeoutMs is >= 10 and <= 60_000, "balance.serial.readTimeoutMs", s.ReadTimeoutMs, "must be 10 to 60000 ms");
        errors.Require(s.WriteTimeoutMs is >= 10 and <= 60_000, "balance.serial.writeTimeoutMs", s.WriteTimeoutMs, "must be 10 to 60000 ms (never infinite: a write to a hung-up line blocks forever)");
        Parity? parity = s.Parity.ToLowerInvariant() switch
        {
            "none" => Parity.None,
            "even" => Parity.Even,
            "odd" => Parity.Odd,
            "mark" => Parity.Mark,
            "space" => Parity.Space,
            _ => null,
        };
        StopBits? stopBits = s.StopBits switch
        {
            "1" => StopBits.One,
            "1.5" => StopBits.OnePointFive,
            "2" => StopBits.Two,
            _ => null,
        };
        Handshake? handshake = s.Handshake.ToLowerInvariant() switch
        {
            "none" => Handshake.None,
            "xonxoff" => Handshake.XOnXOff,
            "rtscts" => Handshake.RequestToSend,
            "both" => Handshake.RequestToSendXOnXOff,
            _ => null,
        };
        errors.Require(parity is not null, "balance.serial.parity", s.Parity, "use none, even, odd, mark or space");
        errors.Require(stopBits is not null, "balance.serial.stopBits", s.StopBits, "use 1, 1.5 or 2");
        errors.Require(handshake is not null, "balance.serial.handshake", s.Handshake, "use none, xonxoff, rtscts or both");
        if (parity is null || stopBits is null || handshake is null)
        {
            return null;
        }

        return new SerialConnector(new SerialLinkSettings
        {
            PortPath = path,
            BaudRate = s.Baud,
            Parity = parity.Value,
            DataBits = s.DataBits,
            StopBits = stopBits.Value,
            Handshake = handshake.Value,
            ReadTimeout = TimeSpan.FromMilliseconds(s.ReadTimeoutMs),
            WriteTimeout = TimeSpan.FromMilliseconds(s.WriteTimeoutMs),
        });
    }
}
