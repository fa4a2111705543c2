using Dapper;
using GelDispense.Contracts.V1;
using Google.Protobuf;
using GelDispense.Service.Batches;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;
using Grpc.Net.Client;

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

    [Theory, SqliteEngine, PostgresEngine]
    public async Task An_addition_keeps_its_answer_as_deflated_bytes_in_under_a_third_of_the_plain_base64_form_and_a_replay_returns_that_answer(string engine)
    {
        var (host, grpc, addition, first) = await FirstStepRecordedAsync(engine, "d1");
        var replay = await grpc.RecordAdditionAsync(addition);

        await using var connection = await RawDatabase.OpenAsync(host);
        var (text, bytes) = await connection.QuerySingleAsync<(string, byte[])>(
            "SELECT response, response_bytes FROM additions WHERE batch_id = @id AND addition_id = 'd1'", new { id = addition.BatchId });
        Assert.Equal("", text);
        var plain = Convert.ToBase64String(first.ToByteArray()).Length;
        Assert.True(bytes.Length * 3 < plain, $"stored {bytes.Length} bytes where the plain base64 form has {plain} characters");
        Assert.True(replay.Replayed);
        replay.Replayed = false;
        Assert.Equal(first, replay);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task An_addition_stored_as_text_before_its_answer_was_kept_as_bytes_still_replays_its_answer(string engine)
    {
        var (host, grpc, addition, first) = await FirstStepRecordedAsync(engine, "t1");

        // The row as the version before migration 0008 wrote it: the deflated base64 text, no bytes.
        await using (var connection = await RawDatabase.OpenAsync(host))
        {
            await connection.ExecuteAsync(
                "UPDATE additions SET response = @text, response_bytes = NULL WHERE batch_id = @id AND addition_id = 't1'",
                new { text = StoredResponse.Write(first), id = addition.BatchId });
        }

        var replay = await grpc.RecordAdditionAsync(addition);

        Assert.True(replay.Replayed);
        replay.Replayed = false;
        Assert.Equal(first, replay);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_replica_whose_own_last_write_to_a_batch_is_out_of_date_records_on_the_batch_as_it_now_stands(string engine)
    {
        var host = await hosts.ForAsync(engine);
        await using var other = host.WithWebHostBuilder(_ => { });
        var here = new BatchService.BatchServiceClient(host.Channel());
        var there = new BatchService.BatchServiceClient(GrpcChannel.ForAddress(other.Server.BaseAddress, new GrpcChannelOptions { HttpHandler = other.Server.CreateHandler() }));
        var admin = new Metadata { { "Authorization", "Bearer " + host.AdminKey } };
        var id = (string)(await Demo.StartBatchAsync(host.CreateClient()))["id"]!;
        RecordAdditionRequest Addition(string additionId, double readingG) => new() { BatchId = id, AdditionId = additionId, StepIndex = 0, ReadingG = readingG, Stable = true };

        await here.RecordAdditionAsync(Addition("r1", 1.0));
        var elsewhere = await there.RecordAdditionAsync(Addition("r2", 2.0), admin);
        var replayed = await here.RecordAdditionAsync(Addition("r2", 2.0));
        var third = await here.RecordAdditionAsync(Addition("r3", 3.0));

        Assert.True(replayed.Replayed);
        Assert.Equal(elsewhere.AsMade, replayed.AsMade);
        var batch = await here.GetBatchAsync(new GetBatchRequest { Id = id });
        Assert.Equal(["r1", "r2", "r3"], batch.Additions.Select(a => a.AdditionId));
        Assert.Equal(4, batch.Version);
        // Judged with r2 in the vessel: the answer's as-made is the one computed from the database afterwards.
        Assert.Equal(await here.GetAsMadeAsync(new GetAsMadeRequest { BatchId = id }), third.AsMade);
    }

    /// <summary>A new batch of the demo recipe with its first step recorded at its target reading over gRPC.</summary>
    private async Task<(ServiceHost Host, BatchService.BatchServiceClient Grpc, RecordAdditionRequest Addition, RecordAdditionResponse First)> FirstStepRecordedAsync(
        string engine, string additionId)
    {
        var host = await hosts.ForAsync(engine);
        var grpc = new BatchService.BatchServiceClient(host.Channel());
        var batch = await grpc.CreateBatchAsync(Corrections.CreateRequest("bench-deflate"));
        var addition = Corrections.Add(batch, additionId, 0, batch.Steps[0].TargetReadingG);
        return (host, grpc, addition, await grpc.RecordAdditionAsync(addition));
    }
}
