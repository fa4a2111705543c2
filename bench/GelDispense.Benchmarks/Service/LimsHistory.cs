using GelDispense.Agent.Demo;
using GelDispense.Contracts.V1;
using GelDispense.Service.Extensions;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;
using Grpc.Net.Client;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;

namespace GelDispense.Benchmarks.Service;

/// <summary>
/// A throwaway PostgreSQL cluster holding a seeded station history, and the real service on it in this process
/// (built by the same call as its Program.cs, gRPC over plaintext HTTP/2 on a free loopback port), with a
/// gRPC client that calls it under a LIMS key. The service migrates the empty database itself and creates the
/// template batch from the agent's demo recipe through its own CreateBatch; the seeder then writes the history.
/// </summary>
public sealed class LimsHistory : IAsyncDisposable
{
    private readonly LocalPostgres _postgres;
    private readonly WebApplication _app;
    private readonly GrpcChannel _channel;
    private readonly DirectoryInfo _directory;

    private LimsHistory(LocalPostgres postgres, WebApplication app, GrpcChannel channel, DirectoryInfo directory, Metadata lims, SeededHistory history)
    {
        _postgres = postgres;
        _app = app;
        _channel = channel;
        _directory = directory;
        Lims = lims;
        History = history;
        Client = new BatchService.BatchServiceClient(channel);
    }

    public BatchService.BatchServiceClient Client { get; }

    /// <summary>The Authorization header of a LIMS key.</summary>
    public Metadata Lims { get; }

    public SeededHistory History { get; }

    public string ConnectionString => _postgres.ConnectionString;

    public static async Task<LimsHistory> StartAsync(int additions)
    {
        var postgres = await LocalPostgres.StartAsync();
        var directory = Directory.CreateTempSubdirectory("gd-lims-bench-");
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions { ContentRootPath = directory.FullName, EnvironmentName = Environments.Production, Args = [] });
        builder.Configuration.AddInMemoryCollection(new Dictionary<string, string?>
        {
            ["Kestrel:Endpoints:Grpc:Url"] = "http://127.0.0.1:0",
            ["Kestrel:Endpoints:Grpc:Protocols"] = "Http2",
            ["Storage:Provider"] = "Postgres",
            ["ConnectionStrings:GelDispense"] = postgres.ConnectionString,
            ["Serilog:MinimumLevel:Default"] = "Warning",
            ["Serilog:MinimumLevel:Override:Microsoft"] = "Warning",
            ["Auth:BootstrapKeyFile"] = Path.Combine(directory.FullName, "admin.key"),
            // The benchmark measures the page, not the per-key limiter.
            ["Auth:PermitsPerSecondPerKey"] = "0",
        });
        var app = builder.BuildGelDispense();
        await app.StartAsync();
        var address = app.Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!.Addresses.First();
        var channel = GrpcChannel.ForAddress(address, new GrpcChannelOptions { MaxReceiveMessageSize = 64 << 20 });
        var issuer = app.Services.GetRequiredService<ApiKeyIssuer>();
        var station = Bearer((await issuer.IssueAsync(Roles.Station, DemoScenario.StationId, null, "bench station", CancellationToken.None)).Key);
        var lims = Bearer((await issuer.IssueAsync(Roles.Lims, "", null, "bench lims", CancellationToken.None)).Key);
        var template = await new BatchService.BatchServiceClient(channel).CreateBatchAsync(new CreateBatchRequest
        {
            StationId = DemoScenario.StationId, Recipe = DemoScenario.Recipe(), Balance = DemoScenario.Balance, Pipette = DemoScenario.Pipette,
        }, station);
        var history = await HistorySeeder.SeedAsync(postgres.ConnectionString, template.Id, additions);
        return new LimsHistory(postgres, app, channel, directory, lims, history);
    }

    public async ValueTask DisposeAsync()
    {
        _channel.Dispose();
        await _app.StopAsync();
        await _app.DisposeAsync();
        await _postgres.DisposeAsync();
        _directory.Delete(recursive: true);
    }

    private static Metadata Bearer(string key) => new() { { "Authorization", $"Bearer {key}" } };
}
