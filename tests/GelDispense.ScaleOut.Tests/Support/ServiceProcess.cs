using System.Collections.Concurrent;
using System.Diagnostics;
using System.Globalization;
using System.Net;
using System.Net.Sockets;

namespace GelDispense.ScaleOut.Tests.Support;

/// <summary>
/// One real service process (<c>dotnet GelDispense.Service.dll</c>, the build copied next to the tests) on PostgreSQL,
/// with its own Kestrel endpoints on free loopback ports: REST over HTTP/1.1, gRPC over plaintext HTTP/2.
/// Output is drained in the background (a full pipe would stall the service) and kept for failure messages.
/// </summary>
internal sealed class ServiceProcess : IAsyncDisposable
{
    private readonly Process _process;
    private readonly ConcurrentQueue<string> _output = new();

    private ServiceProcess(Process process, Uri rest, Uri grpc, string keyFile)
    {
        _process = process;
        Rest = rest;
        Grpc = grpc;
        BootstrapKeyFile = keyFile;
    }

    public Uri Rest { get; }

    public Uri Grpc { get; }

    /// <summary>Where this replica writes the admin key if it finds the key store empty.</summary>
    public string BootstrapKeyFile { get; }

    public string Output => string.Join('\n', _output.TakeLast(40));

    public static async Task<ServiceProcess> StartAsync(string connectionString, string keyDirectory, string name)
    {
        var rest = new Uri($"http://127.0.0.1:{FreePort()}");
        var grpc = new Uri($"http://127.0.0.1:{FreePort()}");
        var keyFile = Path.Combine(keyDirectory, name + ".key");
        var start = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = AppContext.BaseDirectory,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (var argument in new[]
        {
            Path.Combine(AppContext.BaseDirectory, "GelDispense.Service.dll"),
            "--Storage:Provider=Postgres", $"--ConnectionStrings:GelDispense={connectionString}",
            $"--Kestrel:Endpoints:Rest:Url={rest}", "--Kestrel:Endpoints:Rest:Protocols=Http1",
            $"--Kestrel:Endpoints:Grpc:Url={grpc}", "--Kestrel:Endpoints:Grpc:Protocols=Http2",
            $"--Auth:BootstrapKeyFile={keyFile}", "--Serilog:MinimumLevel:Default=Warning",
        })
        {
            start.ArgumentList.Add(argument);
        }

        var process = Process.Start(start) ?? throw new InvalidOperationException($"replica {name} did not start");
        var replica = new ServiceProcess(process, rest, grpc, keyFile);
        process.OutputDataReceived += (_, e) => replica.Keep(e.Data);
        process.ErrorDataReceived += (_, e) => replica.Keep(e.Data);
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        try
        {
            await replica.WaitHealthyAsync(name);
            return replica;
        }
        catch
        {
            // Whatever stopped the wait, a replica nobody holds must not outlive the test.
            await replica.DisposeAsync();
            throw;
        }
    }

    /// <summary>Ends the process at once, as a crash or a killed pod would: no graceful drain.</summary>
    public async Task KillAsync()
    {
        if (!_process.HasExited)
        {
            _process.Kill(entireProcessTree: true);
        }

        await _process.WaitForExitAsync();
    }

    /// <summary>
    /// Sends SIGTERM and waits for the process to end, as Kubernetes stops a pod in a rolling update: the host drains
    /// the calls in flight and closes its connections with GOAWAY.
    /// </summary>
    public async Task StopAsync()
    {
        using (var signal = Process.Start("kill", ["-TERM", _process.Id.ToString(CultureInfo.InvariantCulture)]))
        {
            await signal.WaitForExitAsync();
        }

        using var patience = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        await _process.WaitForExitAsync(patience.Token);
    }

    public async ValueTask DisposeAsync()
    {
        await KillAsync();
        _process.Dispose();
    }

    private void Keep(string? line)
    {
        if (line is not null)
        {
            _output.Enqueue(line);
        }
    }

    private async Task WaitHealthyAsync(string name)
    {
        using var http = new HttpClient { Timeout = TimeSpan.FromSeconds(2) };
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(30);
        while (DateTime.UtcNow < until && !_process.HasExited)
        {
            try
            {
                if ((await http.GetAsync(new Uri(Rest, "/healthz"))).StatusCode == HttpStatusCode.OK)
                {
                    return;
                }
            }
            catch (Exception e) when (e is HttpRequestException or TaskCanceledException)
            {
                // Not listening yet, or still starting up on a busy machine.
            }

            await Task.Delay(100);
        }

        throw new InvalidOperationException($"replica {name} never answered /healthz:\n{Output}");
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
