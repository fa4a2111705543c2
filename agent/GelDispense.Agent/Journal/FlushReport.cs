namespace GelDispense.Agent.Journal;

/// <summary>
/// The outcome of offering the pending entries to the service, in journal order: what was delivered, and, when the
/// service could not be reached, why and how many entries still wait.
/// </summary>
public sealed record FlushReport(IReadOnlyList<Delivery> Deliveries, string? UnreachableBecause, int StillPending)
{
    public bool Complete => UnreachableBecause is null;

    public Delivery? For(string additionId) => Deliveries.FirstOrDefault(d => d.Entry.AdditionId == additionId);
}
