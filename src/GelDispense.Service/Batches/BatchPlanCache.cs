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

    /// <summary>
    /// The basis of a batch about to be stored, from the recipe, devices and first plan its creation has in hand: the
    /// same objects its stored origin parses back to (protobuf JSON round-trips them exactly). Batches started from the
    /// same recipe on the same devices, with the same options and first plan, share one basis, so it is built once for all of them.
    /// </summary>
    public async Task<BatchBasis> BasisOfNewAsync(Recipe recipe, CreateBatchRequest setup, DispensingPlan firstPlan, CancellationToken cancellationToken)
    {
        var devices = new CreateBatchRequest { Recipe = recipe, Balance = setup.Balance, Pipette = setup.Pipette, Air = setup.Air, Options = setup.Options };
        var key = new ContentKey(devices.ToByteString(), firstPlan.ToByteString());
        if (_cache.TryGetValue(key, out BatchBasis? cached) && cached is not null)
        {
            return cached;
        }

        // Copies: the basis outlives this request and keeps parts of them.
        return Keep(key, await BatchBasis.CreateAsync(recipe.Clone(), setup.Clone(), firstPlan.Clone(), reagents, cancellationToken));
    }

    /// <summary>Keeps <paramref name="basis"/> for a batch just stored, so its first addition neither reads its origin back nor rebuilds it.</summary>
    public void Adopt(string batchId, BatchBasis basis) => Keep(new BasisKey(batchId), basis);

    public void Dispose() => _cache.Dispose();

    private T Keep<T>(object key, T value) => _cache.Set(key, value, new MemoryCacheEntryOptions { Size = 1 });

    private readonly record struct BasisKey(string BatchId);

    private readonly record struct RevisionKey(string BatchId, long Revision);

    private readonly record struct ContentKey(ByteString RecipeAndDevices, ByteString FirstPlan);
}
