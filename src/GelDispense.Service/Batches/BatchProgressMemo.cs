using GelDispense.Service.Storage;
using Microsoft.Extensions.Caching.Memory;

namespace GelDispense.Service.Batches;

/// <summary>
/// Each batch's progress as this process's last addition to it left it, so the next addition to the same batch starts
/// from it instead of reading the batch again (one database round trip less per addition). Safe because the write it
/// leads to is version-checked: if anything wrote the batch since — another replica, a correction, a status change —
/// that write loses and writes nothing, and the recorder drops the entry and reads the batch from the database.
/// </summary>
public sealed class BatchProgressMemo : IDisposable
{
    /// <summary>Batches kept; the least recently used go first beyond it.</summary>
    public const int Capacity = 4096;

    private readonly MemoryCache _progress = new(new MemoryCacheOptions { SizeLimit = Capacity });

    public BatchProgress? Find(string batchId) => _progress.TryGetValue(batchId, out BatchProgress? progress) ? progress : null;

    /// <summary>
    /// The batch after <paramref name="before"/> took <paramref name="added"/> in one write (which bumps the version by
    /// one) and now has <paramref name="planRevision"/> in force; the stored response is not kept (only a replay reads it,
    /// from the database).
    /// </summary>
    public void RememberAfter(BatchProgress before, AdditionRow added, long planRevision)
    {
        var head = before.Head;
        var kept = new AdditionRow
        {
            BatchId = added.BatchId, AdditionId = added.AdditionId, Ordinal = added.Ordinal, StepIndex = added.StepIndex, ReadingG = added.ReadingG,
            Stable = added.Stable, Source = added.Source, LotId = added.LotId, TrueMassG = added.TrueMassG, WithinWindow = added.WithinWindow,
            RecordedAt = added.RecordedAt, ContentHash = added.ContentHash, PlanRevision = added.PlanRevision, TargetMassG = added.TargetMassG,
            AcceptanceG = added.AcceptanceG,
        };
        var after = new BatchHead { Id = head.Id, Status = head.Status, StationId = head.StationId, Version = head.Version + 1, PlanRevision = planRevision };
        _progress.Set(head.Id, new BatchProgress(after, [.. before.Additions, kept], before.Corrections), new MemoryCacheEntryOptions { Size = 1 });
    }

    public void Forget(string batchId) => _progress.Remove(batchId);

    public void Dispose() => _progress.Dispose();
}
