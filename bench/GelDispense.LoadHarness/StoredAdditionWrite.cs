using System.Globalization;
using GelDispense.Service.Storage;

namespace GelDispense.LoadHarness;

/// <summary>
/// The second baseline: the service's own storage write of an addition (<see cref="BatchStore.TryAppendAdditionAsync"/>:
/// the version claim, the addition row, the hash-chained event, the batch's new version and the event counter, one
/// statement in its own transaction), called in a loop on a batch of its own (<paramref name="batchId"/>) with rows like
/// <paramref name="template"/>. No request, key check, chemistry or answer: what is left between this and the
/// stations is the service's part, and between this and the raw inserts the part the schema asks of the database.
/// </summary>
public sealed class StoredAdditionWrite(BatchStore store, StoredAdditionWrite.Template template, string batchId, TimeProvider time) : ILoadClient
{
    /// <summary>A stored addition as a bulk read gives it (no answer), its answer bytes and its event, from the template batch.</summary>
    public sealed record Template(AdditionRow Addition, byte[]? ResponseBytes, string EventBody, EventAudit Audit)
    {
        public static async Task<Template> ReadAsync(BatchStore store, string batchId, string additionId)
        {
            var (events, additions, _) = await store.AuditTrailAsync(batchId, CancellationToken.None);
            var recorded = events.Single(e => e.AdditionId == additionId);
            var (_, bytes) = await store.ResponseAsync(batchId, additionId, CancellationToken.None);
            return new Template(additions[additionId], bytes, recorded.Body, new EventAudit(recorded.ActorKeyId, recorded.StationId));
        }
    }

    private long _version = -1;
    private long _ordinal = -1;

    public async Task PrepareAsync(CancellationToken cancellationToken)
    {
        if (_version < 0)
        {
            var batch = await store.FindAsync(batchId, cancellationToken) ?? throw new InvalidOperationException($"Batch {batchId} is not stored.");
            _version = batch.Version;
        }
    }

    public async Task CallAsync(CancellationToken cancellationToken)
    {
        var ordinal = ++_ordinal;
        var at = time.GetUtcNow();
        var row = template.Addition;
        var addition = new AdditionRow
        {
            BatchId = batchId, AdditionId = string.Create(CultureInfo.InvariantCulture, $"stored-{ordinal}"), Ordinal = ordinal,
            StepIndex = row.StepIndex, ReadingG = row.ReadingG, Stable = row.Stable, Source = row.Source, LotId = row.LotId,
            TrueMassG = row.TrueMassG, WithinWindow = row.WithinWindow, RecordedAt = TimeText.Format(at), ContentHash = row.ContentHash,
            ResponseBytes = template.ResponseBytes, PlanRevision = row.PlanRevision, TargetMassG = row.TargetMassG, AcceptanceG = row.AcceptanceG,
        };
        var outcome = await store.TryAppendAdditionAsync(addition, _version, null, template.EventBody, at, template.Audit, cancellationToken);
        _version = outcome.Written
            ? _version + 1
            : throw new InvalidOperationException($"Batch {batchId} moved past version {_version}: another writer on a loop's own batch.");
    }

    public void Dispose()
    {
    }
}
