using GelDispense.Contracts.V1;
using GelDispense.Service.Storage;
using Grpc.Net.Client;

namespace GelDispense.LoadHarness;

/// <summary>
/// Addition ingest on PostgreSQL: N stations, each with its own station key, making its own demo batches and
/// recording their additions over gRPC and over REST; and, as the baseline, N raw insert loops writing rows like the
/// service's into the same additions table, each on its own connection and its own batch; and, between the two, N
/// loops of the service's own storage write of an addition (<see cref="StoredAdditionWrite"/>), each on its own batch.
/// </summary>
public static class IngestScenarios
{
    public const string Ingest = "addition ingest, own station key and batch each";
    public const string RawInsert = "raw Npgsql INSERT into additions, own connection each";
    public const string StoredWrite = "the service's storage write alone (BatchStore), own batch each";

    public static async Task<IReadOnlyList<Scenario>> CreateAsync(
        InProcessService service, string connectionString, BatchStore store, DemoWorkload workload, int stations)
    {
        var keys = await StationKey.IssueAsync(service.GrpcAddress, service.ApiKey, Enumerable.Range(1, stations).Select(k => $"ingest-{k:00}"));

        // The raw loops need batches to satisfy the foreign key; the service starts them, untimed, under the admin key.
        using var channel = GrpcChannel.ForAddress(service.GrpcAddress);
        var batches = new BatchService.BatchServiceClient(channel);
        var headers = GrpcCall.Headers(service.ApiKey);
        var rawBatches = new List<Batch>();
        var storedBatches = new List<Batch>();
        for (var k = 1; k <= stations; k++)
        {
            rawBatches.Add(await batches.CreateBatchAsync(workload.BatchRequestFor($"raw-{k:00}"), headers));
            storedBatches.Add(await batches.CreateBatchAsync(workload.BatchRequestFor($"stored-{k:00}"), headers));
        }

        var first = rawBatches[0];
        var recorded = await batches.RecordAdditionAsync(new RecordAdditionRequest
        {
            BatchId = first.Id, AdditionId = "template", StepIndex = first.Steps[0].Index, ReadingG = first.Steps[0].TargetReadingG, Stable = true,
        }, headers);
        var template = await AdditionTemplate.ReadAsync(connectionString, first.Id, recorded.Addition.AdditionId);
        var stored = await StoredAdditionWrite.Template.ReadAsync(store, first.Id, recorded.Addition.AdditionId);

        return
        [
            new(Ingest, "gRPC", stations, k => new GrpcStation(service.GrpcAddress, keys[k], workload.BatchRequestFor(keys[k].StationId))),
            new(Ingest, "REST", stations, k => new AdditionSequence(service.RestAddress, keys[k].Key, workload.BatchJsonFor(keys[k].StationId), k)),
            new(StoredWrite, "Npgsql", stations, k => new StoredAdditionWrite(store, stored, storedBatches[k].Id, TimeProvider.System)),
            new(RawInsert, "Npgsql", stations, k => new RawAdditionInsert(connectionString, template, rawBatches[k].Id, TimeProvider.System)),
        ];
    }
}
