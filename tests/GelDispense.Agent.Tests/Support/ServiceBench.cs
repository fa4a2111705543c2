using GelDispense.Agent.Demo;
using GelDispense.Agent.Hosting;
using GelDispense.Agent.Journal;
using GelDispense.Agent.Service;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using Grpc.Core.Interceptors;
using Grpc.Net.Client;

namespace GelDispense.Agent.Tests.Support;

/// <summary>
/// The real service in-process on a SQLite file, a station key issued by it, a real channel (optionally through a
/// test interceptor) with the agent's Polly link, and the demo batch started on it.
/// </summary>
internal sealed class ServiceBench : IAsyncDisposable
{
    private ServiceBench(EmbeddedService service, GrpcChannel channel, ServiceLink link, Batch batch)
    {
        Service = service;
        Channel = channel;
        Link = link;
        Batch = batch;
    }

    public EmbeddedService Service { get; }

    public GrpcChannel Channel { get; }

    public ServiceLink Link { get; }

    public Batch Batch { get; }

    public static async Task<ServiceBench> StartAsync(string databaseFile, Interceptor? interceptor = null)
    {
        var service = await EmbeddedService.StartAsync(databaseFile);
        var channel = GrpcChannel.ForAddress(service.Address);
        var invoker = interceptor is null ? channel.CreateCallInvoker() : channel.Intercept(interceptor);
        var link = new ServiceLink(invoker, "test", StationRig.QuickLink, TimeProvider.System, await service.IssueKeyAsync(Roles.Station, DemoScenario.StationId));
        var batch = await link.CreateBatchAsync(
            new CreateBatchRequest { StationId = DemoScenario.StationId, Recipe = DemoScenario.Recipe(), Balance = DemoScenario.Balance, Pipette = DemoScenario.Pipette }, default);
        return new ServiceBench(service, channel, link, batch);
    }

    /// <summary>An addition of a step's target reading, as the station would confirm it.</summary>
    public NewAddition Addition(int step) =>
        new(Guid.CreateVersion7(), Batch.Id, step, Batch.Steps[step].TargetReadingG, "balance", DemoScenario.Lots[Batch.Steps[step].ReagentId]);

    public async ValueTask DisposeAsync()
    {
        Channel.Dispose();
        await Service.DisposeAsync();
    }
}
