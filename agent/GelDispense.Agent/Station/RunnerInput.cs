using GelDispense.Agent.Journal;
using GelDispense.Agent.Links;
using GelDispense.Agent.Readings;
using GelDispense.Agent.Service;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Station;

/// <summary>
/// Everything the sequencer reacts to, merged into one queue so that one thread owns the batch state: balance lines,
/// link and service status changes, keys, finished sends and replays, and clock ticks.
/// </summary>
internal abstract record RunnerInput
{
    public sealed record Reading(ReadingEvent Event) : RunnerInput;

    public sealed record LinkChanged(LinkStatusChange Change) : RunnerInput;

    public sealed record ServiceChanged(ServiceStatusChange Change) : RunnerInput;

    public sealed record Key(char Char) : RunnerInput;

    /// <summary>The flush started for a confirmed addition ended; <paramref name="Fresh"/> is the batch re-read after a replay.</summary>
    public sealed record Recorded(JournalEntry Entry, FlushReport Report, Batch? Fresh) : RunnerInput;

    /// <summary>A background replay of pending entries ended.</summary>
    public sealed record Flushed(FlushReport Report, Batch? Fresh) : RunnerInput;

    public sealed record Tick : RunnerInput;
}
