namespace GelDispense.Agent.Journal;

/// <summary>
/// The outcome of offering the pending entries to the service, in journal order: what was delivered, and, when the
/// flush stopped early (the service unreachable, or refusing the station's key), why and how many entries still wait.
/// </summary>
public sealed record FlushReport(IReadOnlyList<Delivery> Deliveries, string? StoppedBecause, int StillPending)
{
    public bool Complete => StoppedBecause is null;

    public Delivery? For(string additionId) => Deliveries.FirstOrDefault(d => d.Entry.AdditionId == additionId);
}
