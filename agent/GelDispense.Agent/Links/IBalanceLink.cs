namespace GelDispense.Agent.Links;

/// <summary>
/// The balance as the rest of the agent sees it: lines in, command strings out, and status changes.
/// The transport (serial port, TCP, a simulator) is behind it and reconnects by itself.
/// </summary>
public interface IBalanceLink : IAsyncDisposable
{
    LinkStatus Status { get; }

    /// <summary>Raised on the link's own thread; handlers must return quickly.</summary>
    event EventHandler<LinkStatusChange>? StatusChanged;

    /// <summary>Where the link goes, for display (a port path or host:port).</summary>
    string Describe { get; }

    /// <summary>Starts reading and (re)connecting in the background.</summary>
    void Start();

    /// <summary>Lines for a single consumer, until the link is disposed or the token is cancelled.</summary>
    IAsyncEnumerable<ReceivedLine> ReadLinesAsync(CancellationToken cancellationToken);

    /// <summary>Sends a command followed by the configured line ending; false when not connected or the write failed.</summary>
    Task<bool> SendAsync(string command, CancellationToken cancellationToken);
}
