using GelDispense.Agent.Configuration;
using GelDispense.Agent.Service;
using GelDispense.ScaleOut.Tests.ScaleOut;
using GelDispense.ScaleOut.Tests.Support;
using GelDispense.Contracts.V1;
using Grpc.Net.Client;

namespace GelDispense.ScaleOut.Tests.Service;

/// <summary>
/// The agent's service connection opened from a station config naming replica A as its service and B as standby:
/// A is killed or stopped while the station is still adding, and the rest of the batch goes through B on the same
/// database.
/// </summary>
[Collection(ScaleOutCollection.Name)]
public sealed class ServiceConnectionTests(PostgresCluster cluster)
{
    private const int Additions = 20;

    [Theory]
    [InlineData("killed")]
    [InlineData("stopped")]
    public async Task When_replica_A_goes_away_mid_batch_the_link_carries_on_through_B_and_no_addition_is_lost_or_doubled(string how)
    {
        await using var pair = await ReplicaPair.StartAsync(cluster.Server, $"scaleout_failover_{how}");
        var config = new StationConfig { ServiceAddress = pair.A.Grpc.ToString(), StandbyAddresses = [pair.B.Grpc.ToString()], ApiKey = pair.AdminKey };
        using var connection = ServiceConnection.Open(config, QuickLink.Settings, TimeProvider.System);
        var link = connection.Link;
        var batch = await link.CreateBatchAsync(TwoReplicasTests.DemoRequest(), default);
        var planned = PlannedAddition.Split(batch, Additions, "failover");
        var halfway = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        var servedBy = new List<Uri>();

        // The station keeps adding while A is killed, so a call may be in flight to A when it dies.
        var station = Task.Run(async () =>
        {
            foreach (var addition in planned)
            {
                servedBy.Add(connection.Current);
                await link.RecordAdditionAsync(new RecordAdditionRequest
                {
                    BatchId = batch.Id, AdditionId = addition.AdditionId, StepIndex = addition.StepIndex, ReadingG = addition.ReadingG, Stable = true, LotId = addition.LotId,
                }, default);
                if (servedBy.Count == Additions / 2)
                {
                    halfway.SetResult();
                }
            }
        });
        await halfway.Task;
        // Killed: a crash, no drain. Stopped: SIGTERM, as a rolling update does; A drains and closes its connections.
        await (how == "killed" ? pair.A.KillAsync() : pair.A.StopAsync());
        var goneAt = DateTime.UtcNow;
        await station;
        Console.WriteLine($"failover: the second half of the batch went through B {(DateTime.UtcNow - goneAt).TotalSeconds:0.00} s after A was {how}");

        Assert.Equal(pair.B.Grpc, connection.Current);
        Assert.Equal(pair.A.Grpc, servedBy[0]);
        Assert.Equal(pair.B.Grpc, servedBy[^1]);
        Assert.Equal(ServiceStatus.Online, link.Status);
        using var direct = GrpcChannel.ForAddress(pair.B.Grpc);
        var recorded = await new BatchService.BatchServiceClient(direct)
            .GetBatchAsync(new GetBatchRequest { Id = batch.Id }, new Grpc.Core.Metadata { { "authorization", "Bearer " + pair.AdminKey } });
        Assert.Equal(planned.Select(a => a.AdditionId), recorded.Additions.Select(a => a.AdditionId));
    }

    [Fact]
    public void A_link_without_any_address_is_refused_naming_the_field()
    {
        var ex = Assert.Throws<ArgumentException>(() => new FailoverCallInvoker([], QuickLink.Settings));

        Assert.Contains("addresses", ex.Message, StringComparison.Ordinal);
    }
}
