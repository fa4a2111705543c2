using GelDispense.Contracts.V1;
using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Batches;

[Collection(ApiCollection.Name)]
public sealed class AdditionRecorderTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task Concurrent_additions_from_many_clients_are_each_recorded_exactly_once(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var id = (string)(await Demo.StartBatchAsync(host.CreateClient()))["id"]!;
        const int clients = 12;

        // Half the clients speak REST, half gRPC; every client also replays its own addition once.
        var work = Enumerable.Range(0, clients).Select(async i =>
        {
            for (var send = 0; send < 2; send++)
            {
                if (i % 2 == 0)
                {
                    await Demo.PostAsync(host.CreateClient(), $"/v1/batches/{id}/additions", Demo.Addition($"c{i}", i % 3, 1.0 + i));
                }
                else
                {
                    var grpc = new BatchService.BatchServiceClient(host.Channel());
                    await grpc.RecordAdditionAsync(new RecordAdditionRequest { BatchId = id, AdditionId = $"c{i}", StepIndex = i % 3, ReadingG = 1.0 + i, Stable = true });
                }
            }
        });
        await Task.WhenAll(work);

        var batch = await new BatchService.BatchServiceClient(host.Channel()).GetBatchAsync(new GetBatchRequest { Id = id });
        Assert.Equal(clients, batch.Additions.Count);
        Assert.Equal(Enumerable.Range(0, clients).Select(i => $"c{i}").Order(), batch.Additions.Select(a => a.AdditionId).Order());
        Assert.Equal(1 + clients, batch.Version);
        var events = await new BatchService.BatchServiceClient(host.Channel()).GetAsMadeAsync(new GetAsMadeRequest { BatchId = id });
        Assert.Equal(3, events.StepsDone);
    }
}
