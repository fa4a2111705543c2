using System.Diagnostics;
using System.Net;
using System.Net.Sockets;
using Npgsql;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>
/// A throwaway PostgreSQL cluster from the binaries installed on this machine: initdb into a temp dir, pg_ctl
/// start on a free loopback port, stop and delete on dispose. initdb refuses to run as root, so it runs as the
/// postgres user through runuser when needed.
/// </summary>
public sealed class LocalPostgres : IAsyncDisposable
{
    private readonly string _bin;
    private readonly string _dataDir;

    private LocalPostgres(string bin, string dataDir, int port)
    {
        _bin = bin;
        _dataDir = dataDir;
        Port = port;
    }

    public int Port { get; }

    public string ConnectionString => $"Host=127.0.0.1;Port={Port};Username=postgres;Database=postgres;Pooling=true";

    public static string? FindBinaries() =>
        Directory.Exists("/usr/lib/postgresql")
            ? Directory.GetDirectories("/usr/lib/postgresql").Select(d => Path.Combine(d, "bin"))
                .Where(b => File.Exists(Path.Combine(b, "initdb"))).OrderDescending().FirstOrDefault()
            : null;

    public static async Task<LocalPostgres> StartAsync()
    {
        var bin = FindBinaries() ?? throw new InvalidOperationException("No PostgreSQL binaries under /usr/lib/postgresql.");
        var dataDir = Path.Combine(Path.GetTempPath(), $"geldispense-pg-{Environment.ProcessId}-{Guid.NewGuid():N}");
        var port = FreePort();
        var cluster = new LocalPostgres(bin, dataDir, port);
        await cluster.RunAsync("initdb", $"-D {dataDir} -U postgres -A trust -E UTF8 --locale=C.UTF-8 --no-sync");
        await cluster.ResumeAsync();
        return cluster;
    }

    /// <summary>
    /// Stops the server (fast shutdown: sessions are ended, as in a restart or a failover), keeping its data. This
    /// process's pooled connections to it are dead from then on, so its pools are cleared for whoever connects next.
    /// </summary>
    public async Task PauseAsync()
    {
        await RunAsync("pg_ctl", $"-D {_dataDir} -m fast -s -w stop");
        NpgsqlConnection.ClearAllPools();
    }

    /// <summary>Starts the server on its port and data, the first time or after <see cref="PauseAsync"/>.</summary>
    public Task ResumeAsync() =>
        RunAsync("pg_ctl", $"-D {_dataDir} -l {_dataDir}/server.log -s -w -t 30 -o \"-p {Port} -k {_dataDir} " +
            "-c listen_addresses=127.0.0.1 -c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=200\" start");

    public async ValueTask DisposeAsync()
    {
        await RunAsync("pg_ctl", $"-D {_dataDir} -m immediate -s -w stop");
        Directory.Delete(_dataDir, recursive: true);
    }

    /// <summary>
    /// Runs a PostgreSQL tool. Only initdb, which leaves no process behind, has its output captured (shown when it
    /// fails): pg_ctl's postmaster would inherit the pipes and hold up our wait, so pg_ctl runs silent (-s) and the
    /// server logs to server.log.
    /// </summary>
    private async Task RunAsync(string tool, string arguments)
    {
        var quiet = tool == "initdb";
        var asRoot = Environment.UserName == "root";
        var start = new ProcessStartInfo(asRoot ? "runuser" : Path.Combine(_bin, tool))
        {
            Arguments = asRoot ? $"-u postgres -- {Path.Combine(_bin, tool)} {arguments}" : arguments,
            UseShellExecute = false,
            RedirectStandardOutput = quiet,
            RedirectStandardError = quiet,
        };
        using var process = Process.Start(start) ?? throw new InvalidOperationException($"{tool} did not start.");
        var output = quiet ? Task.WhenAll(process.StandardOutput.ReadToEndAsync(), process.StandardError.ReadToEndAsync()) : Task.FromResult<string[]>([]);
        await process.WaitForExitAsync();
        if (process.ExitCode != 0)
        {
            throw new InvalidOperationException($"{tool} {arguments} exited with {process.ExitCode}. {string.Join(' ', await output)}");
        }

        await output;
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
