namespace GelDispense.Agent.Readings;

/// <summary>Running tallies for the display and the log; garbage is counted, never fatal.</summary>
public sealed class ReadingCounters
{
    public long Lines { get; internal set; }

    public long Readings { get; internal set; }

    public long Garbage { get; internal set; }

    public long NonTextBytes { get; internal set; }

    public long Reconnects { get; internal set; }
}
