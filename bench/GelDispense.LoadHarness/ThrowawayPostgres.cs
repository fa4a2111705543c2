using System.Diagnostics;

namespace GelDispense.LoadHarness;

/// <summary>
/// A PostgreSQL cluster that lives for one run: initdb into a temporary directory, started on a free loopback port,
/// stopped and deleted on dispose. It runs with the service tests' settings (fsync, synchronous_commit and
/// full_page_writes off: the data is thrown away), so the service and the raw insert loop both commit without
/// waiting for the disk. initdb refuses to run as root, so as root the tools run as the postgres user via runuser.
/// </summary>
public sealed class ThrowawayPostgres : IAsyncDisposable
{
    private readonly string _bin;
    private readonly string _dataDirectory;

    private ThrowawayPostgres(string bin, string dataDirectory, int port)
    {
        (_bin, _dataDirectory) = (bin, dataDirectory);
        ConnectionString = $"Host=127.0.0.1;Port={port};Username=postgres;Database=postgres";
    }

    public string ConnectionString { get; }

    public static async Task<ThrowawayPostgres> StartAsync(int maxConnections)
    {
        var bin = (Directory.Exists("/usr/lib/postgresql") ? Directory.GetDirectories("/usr/lib/postgresql") : [])
            .Select(d => Path.Combine(d, "bin")).Where(b => File.Exists(Path.Combine(b, "initdb"))).OrderDescending().FirstOrDefault()
            ?? throw new InvalidOperationException("No PostgreSQL binaries under /usr/lib/postgresql; install postgresql or pass --postgres.");
        var port = InProcessService.FreePort();
        var cluster = new ThrowawayPostgres(bin, Path.Combine(Path.GetTempPath(), $"geldispense-load-pg-{Guid.NewGuid():N}"), port);
        await cluster.RunAsync("initdb", $"-D {cluster._dataDirectory} -U postgres -A trust -E UTF8 --locale=C.UTF-8 --no-sync", quiet: true);
        await cluster.RunAsync("pg_ctl", $"-D {cluster._dataDirectory} -l {cluster._dataDirectory}/server.log -s -w -t 30 -o \"-p {port} " +
            $"-k {cluster._dataDirectory} -c listen_addresses=127.0.0.1 -c max_connections={maxConnections} " +
            "-c fsync=off -c synchronous_commit=off -c full_page_writes=off\" start");
        return cluster;
    }

    public async ValueTask DisposeAsync()
    {
        await RunAsync("pg_ctl", $"-D {_dataDirectory} -m fast -s -w stop");
        Directory.Delete(_dataDirectory, recursive: true);
    }

    /// <summary>
    /// Runs a PostgreSQL tool. Only a <paramref name="quiet"/> one (initdb, which leaves no process behind) has its
    /// output captured, and shown only when it fails: pg_ctl's postmaster would inherit the pipes and hold up our
    /// wait, so pg_ctl runs silent (-s) and the server logs to server.log.
    /// </summary>
    private async Task RunAsync(string tool, string arguments, bool quiet = false)
    {
        var path = Path.Combine(_bin, tool);
        var asRoot = Environment.UserName == "root";
        var start = new ProcessStartInfo(asRoot ? "runuser" : path, asRoot ? $"-u postgres -- {path} {arguments}" : arguments)
        {
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
}
