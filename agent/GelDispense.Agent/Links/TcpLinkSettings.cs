namespace GelDispense.Agent.Links;

/// <summary>A balance behind a serial-to-network adapter, or the simulator, at host:port.</summary>
public sealed record TcpLinkSettings
{
    public required string Host { get; init; }

    public required int Port { get; init; }

    public TimeSpan ConnectTimeout { get; init; } = TimeSpan.FromSeconds(3);

    public TimeSpan ReadTimeout { get; init; } = TimeSpan.FromMilliseconds(500);

    public TimeSpan WriteTimeout { get; init; } = TimeSpan.FromSeconds(1);

    /// <summary>
    /// Quiet time before the first keep-alive probe, then the gap between probes and how many may go unanswered. A
    /// pulled network cable gives no error at all, and the operating system's default first probe comes after two
    /// hours; with these a dead adapter is a lost line within about 20 s even for a balance that only answers requests.
    /// </summary>
    public TimeSpan KeepAliveIdle { get; init; } = TimeSpan.FromSeconds(10);

    public TimeSpan KeepAliveInterval { get; init; } = TimeSpan.FromSeconds(3);

    public int KeepAliveProbes { get; init; } = 3;
}
