using GelDispense.Agent.Demo;
using GelDispense.Agent.Service;
using GelDispense.Agent.Tests.Support;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;

namespace GelDispense.Agent.Tests.Service;

/// <summary>Failover over real HTTP/2 connections: a replica that goes away under a call, then the real service.</summary>
[Collection(StationCollection.Name)]
public sealed class FailoverCallInvokerTests : TempDirectoryTest
{
    [Fact]
    public async Task An_addition_whose_connection_the_first_replica_closes_under_it_is_recorded_once_through_the_next()
    {
        await using var closing = new ClosingHttp2Peer();
        await using var bench = await ServiceBench.StartAsync(Path.Combine(Dir, "service.db"));
        using var invoker = new FailoverCallInvoker([closing.Address, bench.Service.Address], StationRig.QuickLink);
        var link = new ServiceLink(invoker, "closing, then the service", StationRig.QuickLink, TimeProvider.System,
            await bench.Service.IssueKeyAsync(Roles.Station, DemoScenario.StationId));
        var step = bench.Batch.Steps[0];
        var request = new RecordAdditionRequest
        {
            BatchId = bench.Batch.Id, AdditionId = Guid.CreateVersion7().ToString(), StepIndex = step.Index, ReadingG = step.TargetReadingG, Stable = true,
            LotId = DemoScenario.Lots[step.ReagentId],
        };

        var answer = await link.RecordAdditionAsync(request, default);

        Assert.Equal(1, closing.CallsTaken);
        Assert.Equal(bench.Service.Address, invoker.Current);
        Assert.Equal(request.AdditionId, answer.Addition.AdditionId);
        Assert.Equal([request.AdditionId], (await bench.Link.GetBatchAsync(bench.Batch.Id, default)).Additions.Select(a => a.AdditionId));
    }
}
