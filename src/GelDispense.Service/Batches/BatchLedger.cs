using System.Security.Cryptography;
using System.Text;
using GelDispense.Chemistry.Errors;
using GelDispense.Contracts.V1;
using GelDispense.Service.Errors;
using GelDispense.Service.Security;
using GelDispense.Service.Storage;
using Google.Protobuf;
using Google.Protobuf.WellKnownTypes;

namespace GelDispense.Service.Batches;

/// <summary>
/// Batch life cycle over the store: create with a plan, read, complete, abort, and the LIMS page. Writes that
/// lose an optimistic-concurrency race are retried from a fresh read after a short random pause.
/// </summary>
public sealed class BatchLedger(BatchStore store, BatchPlanCache plans, BatchEventSignal signal, TimeProvider time, Random random)
{
    public const int MaxAttempts = 60;
    public const int MaxPageSize = 200;
    public const int DefaultPageSize = 50;

    public async Task<Batch> CreateAsync(CreateBatchRequest request, DispensingPlan plan, Caller caller, CancellationToken cancellationToken)
    {
        if (request.StationId.Trim().Length is 0 or > 64)
        {
            throw new InvalidInputException("stationId", Mapping.RecipeMapping.Clip(request.StationId), "a station id has 1 to 64 characters");
        }

        var recipeBody = JsonFormatter.Default.Format(request.Recipe);
        var setup = request.Clone();
        setup.Recipe = null;
        var at = time.GetUtcNow();
        var id = NewId(at);
        var created = new BatchEvent { BatchId = id, Type = BatchEventType.Created, OccurredAt = Timestamp.FromDateTimeOffset(at), Status = BatchStatus.InProgress };
        var batch = new NewBatch(id, request.StationId.Trim(), request.Recipe.Name.Trim(), recipeBody, Hash(recipeBody),
            JsonFormatter.Default.Format(setup), JsonFormatter.Default.Format(plan), BatchMapping.Stored(BatchStatus.InProgress),
            BatchEventType.Created.ToString(), JsonFormatter.Default.Format(created), at, caller.ActorId);
        // Before storing: a batch whose chemistry cannot be prepared is not stored at all.
        var basis = await plans.BasisOfNewAsync(request.Recipe, setup, plan, cancellationToken);
        BatchRow? stored;
        for (var attempt = 0; (stored = await store.TryCreateAsync(batch, cancellationToken)) is null; attempt++)
        {
            await PauseAsync(attempt, cancellationToken);
        }

        plans.Adopt(id, basis);

        signal.Notify(id);
        // Answered from the row as stored, not read back: a new batch has no additions or corrections yet.
        return BatchMapping.ToContract(stored, [], []);
    }

    public async Task<Batch> GetAsync(string id, CancellationToken cancellationToken)
    {
        var row = await FindAsync(id, "id", cancellationToken);
        return BatchMapping.ToContract(row, await store.AdditionsAsync([row.Id], cancellationToken), await store.CorrectionsAsync([row.Id], cancellationToken));
    }

    public async Task<BatchRow> FindAsync(string id, string field, CancellationToken cancellationToken) =>
        await store.FindAsync(id, cancellationToken) ?? throw ApiException.NotFound(field, id, "batch");

    /// <summary>Completes or aborts an in-progress batch.</summary>
    public async Task<Batch> CloseAsync(string id, BatchStatus status, string reason, Caller caller, CancellationToken cancellationToken)
    {
        if (reason.Length > 500)
        {
            throw new InvalidInputException("reason", Mapping.RecipeMapping.Clip(reason), "a reason has at most 500 characters");
        }

        var type = status == BatchStatus.Completed ? BatchEventType.Completed : BatchEventType.Aborted;
        for (var attempt = 0; ; attempt++)
        {
            var row = await FindAsync(id, "id", cancellationToken);
            RequireInProgress(row.Id, row.Status, "id");
            var at = time.GetUtcNow();
            var body = JsonFormatter.Default.Format(new BatchEvent { BatchId = row.Id, Type = type, OccurredAt = Timestamp.FromDateTimeOffset(at), Status = status });
            var outcome = await store.TrySetStatusAsync(row.Id, row.Version, BatchMapping.Stored(status), reason, type.ToString(), body, at,
                new EventAudit(caller.ActorId, row.StationId), cancellationToken);
            if (outcome.Written)
            {
                signal.Notify(row.Id);
                return await GetAsync(row.Id, cancellationToken);
            }

            await PauseAsync(attempt, cancellationToken);
        }
    }

    public async Task<ListBatchesResponse> ListAsync(ListBatchesRequest request, CancellationToken cancellationToken)
    {
        if (request.PageSize is < 0 or > MaxPageSize)
        {
            throw new InvalidInputException("pageSize", request.PageSize.ToString(System.Globalization.CultureInfo.InvariantCulture), $"a page holds 1 to {MaxPageSize} batches (0 means {DefaultPageSize})");
        }

        var size = request.PageSize == 0 ? DefaultPageSize : request.PageSize;
        var after = PageToken.Decode(request.PageToken);
        var rows = await store.ListChangedAsync(after, request.UpdatedAfter?.ToDateTimeOffset(),
            string.IsNullOrEmpty(request.StationId) ? null : request.StationId, size + 1, cancellationToken);
        var page = rows.Take(size).ToArray();
        var additions = (await store.AdditionsAsync([.. page.Select(r => r.Id)], cancellationToken)).ToLookup(a => a.BatchId);
        var corrections = (await store.CorrectionsAsync([.. page.Select(r => r.Id)], cancellationToken)).ToLookup(c => c.BatchId);
        var response = new ListBatchesResponse
        {
            NextPageToken = PageToken.Encode(page.Length > 0 ? page[^1].LastEventSeq : after),
            HasMore = rows.Count > size,
        };
        response.Batches.AddRange(page.Select(r => BatchMapping.ToContract(r, additions[r.Id], corrections[r.Id])));
        return response;
    }

    public async Task<IReadOnlyList<BatchEvent>> EventsAsync(string batchId, long afterSequence, CancellationToken cancellationToken) =>
        [.. (await store.EventsAsync(batchId, afterSequence, cancellationToken)).Select(BatchMapping.ToContract)];

    public static void RequireInProgress(string batchId, string storedStatus, string field)
    {
        var status = BatchMapping.Status(storedStatus);
        if (status != BatchStatus.InProgress)
        {
            throw ApiException.Conflict(field, batchId, $"the batch is {status.ToString().ToLowerInvariant()}; it accepts no more changes");
        }
    }

    /// <summary>A short random pause that grows with the attempt, so racing writers spread out instead of colliding again.</summary>
    public async Task PauseAsync(int attempt, CancellationToken cancellationToken)
    {
        if (attempt >= MaxAttempts)
        {
            throw new ApiException(Grpc.Core.StatusCode.Aborted, "Too many concurrent changes to this batch; try again.", []);
        }

        await Task.Delay(TimeSpan.FromMilliseconds(random.Next(1, 4 + Math.Min(attempt, 20) * 3)), time, cancellationToken);
    }

    public static string Hash(string text) => Convert.ToHexString(SHA256.HashData(Encoding.UTF8.GetBytes(text)));

    private string NewId(DateTimeOffset at)
    {
        Span<byte> suffix = stackalloc byte[5];
        random.NextBytes(suffix);
        return $"b-{at.UtcDateTime:yyyyMMdd-HHmmss}-{Convert.ToHexString(suffix).ToLowerInvariant()}";
    }
}
