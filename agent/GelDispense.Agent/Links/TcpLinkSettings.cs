namespace GelDispense.Agent.Links;

/// <summary>A balance behind a serial-to-network adapter, or the simulator, at host:port.</summary>
public sealed record TcpLinkSettings
{
    public required string Host { get; init; }

    public required int Port { get; init; }

    public TimeSpan ConnectTimeout { get; init; } = TimeSpan.FromSeconds(3);

    public TimeSpan ReadTimeout { get; init; } = TimeSpan.FromMilliseconds(500);

    public TimeSpan WriteTimeout { get; init; } = TimeSpan.FromSeconds(1);
}
