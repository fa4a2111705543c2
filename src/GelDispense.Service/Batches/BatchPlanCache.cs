using GelDispense.Contracts.V1;
using GelDispense.Service.Api;
using GelDispense.Service.Storage;
using Google.Protobuf;
using Microsoft.Extensions.Caching.Memory;

namespace GelDispense.Service.Batches;

/// <summary>
/// Keeps each batch's prepared chemistry and parsed plan revisions in memory, so an addition does not parse the
/// recipe, resolve reagents and rebuild the first plan on every post. Safe across replicas because nothing cached
/// ever changes once stored: a batch's recipe revision, setup and first plan are fixed, plan revisions are
/// append-only, and custom reagents are never edited. Which revision is in force is always read from the database
/// (<see cref="BatchHead.PlanRevision"/>) and used as part of the key.
/// </summary>
public sealed class BatchPlanCache(BatchStore store, ReagentDirectory reagents) : IDisposable
{
    /// <summary>Entries kept (a basis or a plan revision counts one); the least recently used go first beyond it.</summary>
    public const int Capacity = 4096;

    private readonly MemoryCache _cache = new(new MemoryCacheOptions { SizeLimit = Capacity });

    public async Task<PlanInForce> GetAsync(string batchId, long revision, CancellationToken cancellationToken)
    {
        var key = new RevisionKey(batchId, revision);
        if (_cache.TryGetValue(key, out PlanInForce? cached) && cached is not null)
        {
            return cached;
        }

        var basis = await BasisAsync(batchId, cancellationToken);
        var inForce = revision == 0
            ? new PlanInForce(basis, 0, basis.StoredFirstPlan, 1)
            : await store.PlanRevisionAsync(batchId, revision, cancellationToken) is { } row
                ? new PlanInForce(basis, revision, JsonParser.Default.Parse<DispensingPlan>(row.Plan), row.ScaleFactor)
                : throw new InvalidOperationException($"Batch {batchId} points at plan revision {revision}, which is not stored.");
        return Keep(key, inForce);
    }

    public async Task<BatchBasis> BasisAsync(string batchId, CancellationToken cancellationToken)
    {
        var key = new BasisKey(batchId);
        if (_cache.TryGetValue(key, out BatchBasis? cached) && cached is not null)
        {
            return cached;
        }

        var origin = await store.OriginAsync(batchId, cancellationToken)
            ?? throw new InvalidOperationException($"Batch {batchId} has no stored origin.");
        var basis = await BatchBasis.CreateAsync(JsonParser.Default.Parse<Recipe>(origin.RecipeBody), JsonParser.Default.Parse<CreateBatchRequest>(origin.Setup),
            JsonParser.Default.Parse<DispensingPlan>(origin.FirstPlan), reagents, cancellationToken);
        return Keep(key, basis);
    }

    public void Dispose() => _cache.Dispose();

    private T Keep<T>(object key, T value) => _cache.Set(key, value, new MemoryCacheEntryOptions { Size = 1 });

    private readonly record struct BasisKey(string BatchId);

    private readonly record struct RevisionKey(string BatchId, long Revision);
}
