using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Display;

/// <summary>
/// Where the sequencer shows its work: a live console panel on a terminal, plain log lines elsewhere (the demo in CI,
/// a redirected run). Called from the sequencer's single thread.
/// </summary>
public interface IStationDisplay : IAsyncDisposable
{
    /// <summary>The current state; called on every reading, so implementations throttle.</summary>
    void Show(StationView view);

    /// <summary>Something happened that the technician must read: a step began, an addition was confirmed, a link changed.</summary>
    void Note(NoteKind kind, string text);

    /// <summary>The batch is over: the as-made composition with R and density flags, and where it was computed.</summary>
    void Finish(AsMade asMade, string recipeName, string origin);
}
