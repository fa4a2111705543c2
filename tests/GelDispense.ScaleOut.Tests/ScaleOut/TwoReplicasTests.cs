using System.Collections.Concurrent;
using System.Diagnostics;
using System.Net;
using System.Net.Http.Headers;
using System.Net.Http.Json;
using System.Text.Json;
using GelDispense.Agent.Demo;
using GelDispense.ScaleOut.Tests.Support;
using GelDispense.Contracts.V1;
using Grpc.Core;
using Grpc.Net.Client;

namespace GelDispense.ScaleOut.Tests.ScaleOut;

/// <summary>
/// Two real service processes on one PostgreSQL database, written to at the same time through both, over REST and
/// gRPC. The database is the only thing the replicas share, so what is proven here is that its optimistic batch
/// version and the addition-id rule hold across processes, not just across threads of one process.
/// </summary>
[Collection(ScaleOutCollection.Name)]
public sealed class TwoReplicasTests(PostgresCluster cluster)
{
    private const int DistinctAdditions = 40;
    private const int Repeats = 8;

    [Fact]
    public async Task Additions_posted_through_both_replicas_at_once_are_recorded_once_with_a_gapless_event_log_and_a_true_as_made()
    {
        var clock = Stopwatch.StartNew();
        await using var pair = await ReplicaPair.StartAsync(cluster.Server, "scaleout_concurrent");
        var startedAfter = clock.Elapsed;
        using var channelA = GrpcChannel.ForAddress(pair.A.Grpc);
        using var channelB = GrpcChannel.ForAddress(pair.B.Grpc);
        using var restA = RestClient(pair.A.Rest, pair.AdminKey);
        using var restB = RestClient(pair.B.Rest, pair.AdminKey);
        var grpc = new[] { new BatchService.BatchServiceClient(channelA), new BatchService.BatchServiceClient(channelB) };
        var rest = new[] { restA, restB };
        var auth = new Metadata { { "authorization", "Bearer " + pair.AdminKey } };
        var created = await grpc[0].CreateBatchAsync(DemoRequest(), auth);
        var planned = PlannedAddition.Split(created, DistinctAdditions, "scale");

        // Post k goes over REST when k is even and gRPC when odd, to replica A or B by turns; a repeat of an addition
        // goes through the other replica and the other protocol than its first post, at the same moment.
        var posts = planned.Select((a, k) => (Addition: a, OverRest: k % 2 == 0, Replica: k / 2 % 2))
            .Concat(planned.Take(Repeats).Select((a, k) => (Addition: a, OverRest: k % 2 != 0, Replica: 1 - (k / 2 % 2)))).ToArray();
        var go = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        var contentionRetries = 0;
        var replayed = new ConcurrentBag<string>();
        var tasks = posts.Select(p => Task.Run(async () =>
        {
            await go.Task;
            var (wasReplayed, retries) = p.OverRest
                ? await PostRestAsync(rest[p.Replica], created.Id, p.Addition)
                : await PostGrpcAsync(grpc[p.Replica], auth, created.Id, p.Addition);
            Interlocked.Add(ref contentionRetries, retries);
            if (wasReplayed)
            {
                replayed.Add(p.Addition.AdditionId);
            }
        })).ToArray();
        var posting = Stopwatch.StartNew();
        go.SetResult();
        await Task.WhenAll(tasks);
        var postedIn = posting.Elapsed;

        var batch = await grpc[1].CompleteBatchAsync(new CompleteBatchRequest { Id = created.Id }, auth);
        Assert.Equal(planned.Select(a => a.AdditionId).Order(), batch.Additions.Select(a => a.AdditionId).Order());
        Assert.All(batch.Additions, a => Assert.Equal(planned.Single(p => p.AdditionId == a.AdditionId).ReadingG, a.ReadingG));
        Assert.Equal(Repeats, replayed.Count);
        Assert.Equal(Repeats, replayed.Distinct().Count());

        var events = await HistoryAsync(grpc[0], auth, created.Id);
        Assert.Equal(Enumerable.Range(0, events.Count).Select(i => events[0].Sequence + i), events.Select(e => e.Sequence));
        Assert.Equal(BatchEventType.Created, events[0].Type);
        Assert.Equal(BatchEventType.Completed, events[^1].Type);
        Assert.Equal(planned.Select(a => a.AdditionId).Order(), events.Where(e => e.Type == BatchEventType.AdditionRecorded).Select(e => e.Addition.AdditionId).Order());

        var served = await grpc[0].GetAsMadeAsync(new GetAsMadeRequest { BatchId = created.Id }, auth);
        AsMadeCheck.MatchesChemistry(created, planned, served.Composition);
        Console.WriteLine($"scale-out: replicas up in {startedAfter.TotalSeconds:0.0} s; {posts.Length} posts through 2 replicas in {postedIn.TotalSeconds:0.0} s, " +
            $"{contentionRetries} contention retries, {events.Count} events; whole test {clock.Elapsed.TotalSeconds:0.0} s");
    }

    internal static CreateBatchRequest DemoRequest() => new()
    {
        StationId = DemoScenario.StationId, Recipe = DemoScenario.Recipe(), Balance = DemoScenario.Balance, Pipette = DemoScenario.Pipette,
    };

    private static HttpClient RestClient(Uri address, string key)
    {
        var client = new HttpClient { BaseAddress = address, Timeout = TimeSpan.FromSeconds(20) };
        client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", key);
        return client;
    }

    // The service answers Aborted (409 over REST) when a batch kept changing under it; a client tries again.
    private static async Task<(bool Replayed, int Retries)> PostRestAsync(HttpClient client, string batchId, PlannedAddition addition)
    {
        for (var retries = 0; ; retries++)
        {
            using var response = await client.PostAsJsonAsync($"/v1/batches/{batchId}/additions", new
            {
                additionId = addition.AdditionId, stepIndex = addition.StepIndex, readingG = addition.ReadingG, stable = true, source = "balance", lotId = addition.LotId,
            });
            var body = await response.Content.ReadAsStringAsync();
            if (response.StatusCode == HttpStatusCode.Conflict && body.Contains("concurrent", StringComparison.OrdinalIgnoreCase) && retries < 50)
            {
                continue;
            }

            Assert.True(response.IsSuccessStatusCode, $"REST {addition.AdditionId}: {(int)response.StatusCode} {body}");
            return (JsonDocument.Parse(body).RootElement.GetProperty("replayed").GetBoolean(), retries);
        }
    }

    private static async Task<(bool Replayed, int Retries)> PostGrpcAsync(BatchService.BatchServiceClient client, Metadata auth, string batchId, PlannedAddition addition)
    {
        for (var retries = 0; ; retries++)
        {
            try
            {
                var response = await client.RecordAdditionAsync(new RecordAdditionRequest
                {
                    BatchId = batchId, AdditionId = addition.AdditionId, StepIndex = addition.StepIndex, ReadingG = addition.ReadingG, Stable = true, Source = "balance", LotId = addition.LotId,
                }, auth);
                return (response.Replayed, retries);
            }
            catch (RpcException ex) when (ex.StatusCode == StatusCode.Aborted && retries < 50)
            {
            }
        }
    }

    private static async Task<List<BatchEvent>> HistoryAsync(BatchService.BatchServiceClient client, Metadata auth, string batchId)
    {
        using var watch = client.WatchBatch(new WatchBatchRequest { BatchId = batchId, AfterSequence = 0 }, auth, DateTime.UtcNow.AddSeconds(10));
        var events = new List<BatchEvent>();
        while (await watch.ResponseStream.MoveNext(CancellationToken.None))
        {
            events.Add(watch.ResponseStream.Current);
        }

        return events;
    }
}
