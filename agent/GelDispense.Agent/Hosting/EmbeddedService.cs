using GelDispense.Service.Extensions;
using GelDispense.Service.Security;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;

namespace GelDispense.Agent.Hosting;

/// <summary>
/// The GelDispense service running inside this process on a loopback port over plaintext HTTP/2, on a SQLite
/// file: for the demo, which must run on a fresh clone with nothing else started, and for tests that stop the
/// service mid-batch and start it again on the same file. It is built by the same call as the service's Program.cs.
/// </summary>
public sealed class EmbeddedService : IAsyncDisposable
{
    private readonly WebApplication _app;
    private bool _disposed;

    private EmbeddedService(WebApplication app, Uri address)
    {
        _app = app;
        Address = address;
    }

    public Uri Address { get; }

    public int Port => Address.Port;

    /// <summary>
    /// Issues a key on this service, as an admin would with POST /v1/api-keys: the demo gives its station a station
    /// key, so the agent talks to the embedded service exactly as it would to a real one.
    /// </summary>
    public async Task<string> IssueKeyAsync(string role, string stationId, CancellationToken cancellationToken = default) =>
        (await _app.Services.GetRequiredService<ApiKeyIssuer>().IssueAsync(role, stationId, null, "embedded " + role, cancellationToken).ConfigureAwait(false)).Key;

    /// <param name="databasePath">The SQLite file; created with its directory when missing.</param>
    /// <param name="port">Loopback port for gRPC; 0 picks a free one. Reuse <see cref="Port"/> to restart "the same" service.</param>
    /// <param name="logLevel">Serilog minimum level, e.g. Error to keep a console demo quiet.</param>
    /// <param name="cancellationToken">Cancels the start.</param>
    public static async Task<EmbeddedService> StartAsync(string databasePath, int port = 0, string logLevel = "Warning", CancellationToken cancellationToken = default)
    {
        var root = Path.GetDirectoryName(Path.GetFullPath(databasePath))!;
        Directory.CreateDirectory(root);
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions { ContentRootPath = root, EnvironmentName = "Embedded", Args = [] });
        builder.Configuration.AddInMemoryCollection(new Dictionary<string, string?>
        {
            ["Kestrel:Endpoints:Grpc:Url"] = $"http://127.0.0.1:{port}",
            ["Kestrel:Endpoints:Grpc:Protocols"] = "Http2",
            ["Storage:Provider"] = "Sqlite",
            ["ConnectionStrings:GelDispense"] = $"Data Source={databasePath}",
            ["Serilog:MinimumLevel:Default"] = logLevel,
            ["Serilog:MinimumLevel:Override:Microsoft"] = logLevel,
            ["Serilog:MinimumLevel:Override:Grpc"] = logLevel,
        });
        var app = builder.BuildGelDispense();
        await app.StartAsync(cancellationToken).ConfigureAwait(false);
        var bound = app.Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!.Addresses.First();
        return new EmbeddedService(app, new Uri(bound.Replace("[::]", "127.0.0.1", StringComparison.Ordinal)));
    }

    /// <summary>Stops answering: open calls are cut after a short grace, new connections are refused.</summary>
    public async Task StopAsync()
    {
        using var grace = new CancellationTokenSource(TimeSpan.FromSeconds(2));
        await _app.StopAsync(grace.Token).ConfigureAwait(false);
    }

    public async ValueTask DisposeAsync()
    {
        if (_disposed)
        {
            return;
        }

        _disposed = true;
        await StopAsync().ConfigureAwait(false);
        await _app.DisposeAsync().ConfigureAwait(false);

        // Pooled handles would keep the file open after "the service" is gone; a restart must open it afresh.
        SqliteConnection.ClearAllPools();
    }
}
