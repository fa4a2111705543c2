using System.Net;
using System.Net.Sockets;
using GelDispense.Service.Extensions;
using Microsoft.AspNetCore.Builder;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Hosting;

namespace GelDispense.LoadHarness;

/// <summary>
/// The real service, built by the same call as its Program.cs, on loopback Kestrel: REST (HTTP/1.1) and gRPC
/// (HTTP/2) on two free ports, with SQLite in a temporary directory that is deleted afterwards, or PostgreSQL when
/// given a connection string. Request logging is
/// turned down to warnings, so the figures measure the API and not the console. When the service guards its routes
/// with API keys, the harness uses the admin key the service writes on its first start, and turns the per-key rate
/// limit off: the harness measures the service, not its limiter.
/// </summary>
public sealed class InProcessService : IAsyncDisposable
{
    private readonly WebApplication _app;
    private readonly string _directory;

    private InProcessService(WebApplication app, string directory, Uri rest, Uri grpc, string? apiKey)
    {
        _app = app;
        _directory = directory;
        RestAddress = rest;
        GrpcAddress = grpc;
        ApiKey = apiKey;
    }

    public Uri RestAddress { get; }

    public Uri GrpcAddress { get; }

    /// <summary>The admin key the service issued on its first start, or null when it issues none.</summary>
    public string? ApiKey { get; }

    public static async Task<InProcessService> StartAsync(string? postgresConnection = null)
    {
        var directory = Path.Combine(Path.GetTempPath(), $"geldispense-load-{Guid.NewGuid():N}");
        Directory.CreateDirectory(directory);
        var rest = new Uri($"http://127.0.0.1:{FreePort()}");
        var grpc = new Uri($"http://127.0.0.1:{FreePort()}");
        var keyFile = Path.Combine(directory, "admin.key");
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions
        {
            EnvironmentName = Environments.Production,
            ContentRootPath = AppContext.BaseDirectory,
            Args =
            [
                $"--Kestrel:Endpoints:Rest:Url={rest}", "--Kestrel:Endpoints:Rest:Protocols=Http1",
                $"--Kestrel:Endpoints:Grpc:Url={grpc}", "--Kestrel:Endpoints:Grpc:Protocols=Http2",
                postgresConnection is null ? "--Storage:Provider=Sqlite" : "--Storage:Provider=Postgres",
                $"--ConnectionStrings:GelDispense={postgresConnection ?? $"Data Source={Path.Combine(directory, "geldispense.db")}"}",
                "--Serilog:MinimumLevel:Default=Warning",
                $"--Auth:BootstrapKeyFile={keyFile}", "--Auth:PermitsPerSecondPerKey=0",
            ],
        });
        var app = builder.BuildGelDispense();
        await app.StartAsync();
        var apiKey = File.Exists(keyFile) ? (await File.ReadAllTextAsync(keyFile)).Trim() : null;
        return new InProcessService(app, directory, rest, grpc, apiKey);
    }

    public async ValueTask DisposeAsync()
    {
        await _app.StopAsync();
        await _app.DisposeAsync();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_directory, recursive: true);
    }

    internal static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
