namespace GelDispense.Agent.Links;

/// <summary>The state of the line to the balance, as shown to the technician.</summary>
public enum LinkStatus
{
    /// <summary>First attempt to open the port or socket.</summary>
    Connecting,

    Connected,

    /// <summary>The connection broke (hang-up, unplugged adapter, closed socket, silence); readings stop.</summary>
    Lost,

    /// <summary>Waiting out a backoff delay between attempts to reopen.</summary>
    Reconnecting,

    /// <summary>Stopped on purpose.</summary>
    Closed,
}
