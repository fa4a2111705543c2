using System.Net;
using System.Net.Sockets;
using GelDispense.Service.Extensions;
using GelDispense.Service.Security;
using Microsoft.AspNetCore.Builder;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>
/// The real service built by the same call as Program.cs, on real loopback sockets (Kestrel): REST on HTTP/1.1 and
/// gRPC on HTTP/2, each on a free port, SQLite in a temporary directory. For the tests that need what the in-memory
/// test server cannot give: connection timeouts, peer addresses and TLS. The settings of <see cref="StartAsync"/> override the
/// defaults as command-line arguments would; its configure action may add routes before the start.
/// </summary>
public sealed class KestrelHost : IAsyncDisposable
{
    private readonly WebApplication _app;
    private readonly string _directory;

    private KestrelHost(WebApplication app, string directory, int restPort, int grpcPort)
    {
        _app = app;
        _directory = directory;
        RestPort = restPort;
        GrpcPort = grpcPort;
    }

    public int RestPort { get; }

    public int GrpcPort { get; }

    public IServiceProvider Services => _app.Services;

    public static async Task<KestrelHost> StartAsync(
        IReadOnlyDictionary<string, string> settings, Action<WebApplication>? configure = null, string scheme = "http")
    {
        var directory = Path.Combine(Path.GetTempPath(), $"geldispense-kestrel-{Guid.NewGuid():N}");
        Directory.CreateDirectory(directory);
        var (restPort, grpcPort) = (FreePort(), FreePort());
        var all = new Dictionary<string, string>
        {
            ["Kestrel:Endpoints:Rest:Url"] = $"{scheme}://127.0.0.1:{restPort}",
            ["Kestrel:Endpoints:Rest:Protocols"] = "Http1",
            ["Kestrel:Endpoints:Grpc:Url"] = $"{scheme}://127.0.0.1:{grpcPort}",
            ["Kestrel:Endpoints:Grpc:Protocols"] = "Http2",
            ["Storage:Provider"] = "Sqlite",
            ["ConnectionStrings:GelDispense"] = $"Data Source={Path.Combine(directory, "geldispense.db")}",
            ["Auth:BootstrapKeyFile"] = Path.Combine(directory, "admin.key"),
            ["Serilog:MinimumLevel:Default"] = "Warning",
        };
        foreach (var (key, value) in settings)
        {
            all[key] = value;
        }

        var builder = WebApplication.CreateBuilder(new WebApplicationOptions
        {
            EnvironmentName = "Testing",
            ContentRootPath = AppContext.BaseDirectory,
            Args = [.. all.Select(pair => $"--{pair.Key}={pair.Value}")],
        });
        var app = builder.BuildGelDispense();
        configure?.Invoke(app);
        await app.StartAsync();
        return new KestrelHost(app, directory, restPort, grpcPort);
    }

    /// <summary>Issues a key through the service's own issuer, as POST /v1/api-keys would.</summary>
    public async Task<string> IssueKeyAsync(string role, string stationId = "") =>
        (await Services.GetRequiredService<ApiKeyIssuer>().IssueAsync(role, stationId, null, $"test {role}", CancellationToken.None)).Key;

    public async ValueTask DisposeAsync()
    {
        await _app.StopAsync();
        await _app.DisposeAsync();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_directory, recursive: true);
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
