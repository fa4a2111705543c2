using GelDispense.Agent.Formats;
using GelDispense.Agent.Links;

namespace GelDispense.Agent.Tests.Support;

/// <summary>Links with short timeouts and backoff so fault tests take a second, not a minute.</summary>
internal static class FastLinks
{
    public static readonly ReconnectSettings Reconnect = new()
    {
        FirstDelay = TimeSpan.FromMilliseconds(50),
        MaxDelay = TimeSpan.FromMilliseconds(300),
    };

    public static BalanceLink Serial(string path, LineEnding ending = LineEnding.CrLf) =>
        new(
            new SerialConnector(new SerialLinkSettings
            {
                PortPath = path,
                ReadTimeout = TimeSpan.FromMilliseconds(100),
                WriteTimeout = TimeSpan.FromMilliseconds(500),
                CloseTimeout = TimeSpan.FromSeconds(1),
            }),
            ending,
            128,
            Reconnect,
            TimeProvider.System);

    public static BalanceLink Tcp(int port) =>
        new(
            new TcpConnector(new TcpLinkSettings { Host = "127.0.0.1", Port = port, ReadTimeout = TimeSpan.FromMilliseconds(100) }),
            LineEnding.CrLf,
            128,
            Reconnect,
            TimeProvider.System);
}
