using GelDispense.Contracts.V1;
using Grpc.Core;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.AspNetCore.Server.Kestrel.Core;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;

namespace GelDispense.Agent.Tests.Support;

/// <summary>
/// A real gRPC server on loopback HTTP/2 whose batch service answers every start with UNAVAILABLE, as the service
/// does when its database fails for a moment: a status sent by a server, read from its trailers.
/// </summary>
public sealed class UnavailableBatchService : IAsyncDisposable
{
    private readonly WebApplication _app;
    private readonly Starts _starts;

    private UnavailableBatchService(WebApplication app, Uri address, Starts starts) => (_app, Address, _starts) = (app, address, starts);

    public Uri Address { get; }

    /// <summary>Batch starts the server received.</summary>
    public int StartsReceived => _starts.Count;

    public static async Task<UnavailableBatchService> StartAsync()
    {
        var builder = WebApplication.CreateSlimBuilder();
        builder.WebHost.ConfigureKestrel(k => k.Listen(System.Net.IPAddress.Loopback, 0, o => o.Protocols = HttpProtocols.Http2));
        builder.Logging.ClearProviders();
        var starts = new Starts();
        builder.Services.AddSingleton(starts);
        builder.Services.AddGrpc();
        var app = builder.Build();
        app.MapGrpcService<Refusing>();
        await app.StartAsync();
        var bound = app.Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!.Addresses.First();
        return new UnavailableBatchService(app, new Uri(bound), starts);
    }

    public async ValueTask DisposeAsync() => await _app.DisposeAsync();

    private sealed class Starts
    {
        private int _count;

        public int Count => Volatile.Read(ref _count);

        public void Add() => Interlocked.Increment(ref _count);
    }

    private sealed class Refusing(Starts starts) : BatchService.BatchServiceBase
    {
        public override Task<Batch> CreateBatch(CreateBatchRequest request, ServerCallContext context)
        {
            starts.Add();
            throw new RpcException(new Status(StatusCode.Unavailable, "The database is unavailable for the moment; retry the call."));
        }
    }
}
