using System.Net;
using System.Net.Sockets;
using System.Text;

namespace GelDispense.Deploy.Tests.Docker;

/// <summary>
/// The image's health check script against a real socket on loopback that answers like the service's /healthz:
/// 200 when healthy, 503 when a check (e.g. storage) fails.
/// </summary>
public sealed class HealthcheckScriptTests
{
    [Fact]
    public async Task Script_Passes_WhenHealthzAnswers200_OnThePortOfTheKestrelRestUrl()
    {
        var (exitCode, requestLine) = await RunAgainstAsync("HTTP/1.1 200 OK");
        Assert.Equal(0, exitCode);
        Assert.Equal($"GET {HealthcheckScript.HealthPath} HTTP/1.1", requestLine);
    }

    [Fact]
    public async Task Script_Fails_WhenHealthzAnswers503()
    {
        var (exitCode, _) = await RunAgainstAsync("HTTP/1.1 503 Service Unavailable");
        Assert.Equal(1, exitCode);
    }

    [Fact]
    public async Task Script_Fails_WhenNothingListensOnTheRestPort()
    {
        var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        var port = ((IPEndPoint)listener.LocalEndpoint).Port;
        listener.Stop();
        Assert.Equal(1, await HealthcheckScript.RunAsync($"http://0.0.0.0:{port}"));
    }

    /// <summary>Serves one request with the given status line and returns the script's exit code and the request line it sent.</summary>
    private static async Task<(int ExitCode, string RequestLine)> RunAgainstAsync(string statusLine)
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        var port = ((IPEndPoint)listener.LocalEndpoint).Port;
        var serve = ServeOnceAsync(listener, statusLine);
        var exitCode = await HealthcheckScript.RunAsync($"http://0.0.0.0:{port}");
        // A script that never connected leaves the accept pending; stopping the listener ends it.
        listener.Stop();
        try
        {
            return (exitCode, await serve);
        }
        catch (Exception e) when (e is SocketException or ObjectDisposedException)
        {
            return (exitCode, "(no request)");
        }
    }

    private static async Task<string> ServeOnceAsync(TcpListener listener, string statusLine)
    {
        using var client = await listener.AcceptTcpClientAsync();
        var stream = client.GetStream();
        using var reader = new StreamReader(stream, Encoding.ASCII, leaveOpen: true);
        var requestLine = await reader.ReadLineAsync() ?? "";
        // Read the headers up to the blank line before answering, as a server does.
        string? header;
        do
        {
            header = await reader.ReadLineAsync();
        }
        while (!string.IsNullOrEmpty(header));

        // ASP.NET Core's health-check endpoint answers in plain text.
        var body = statusLine.Contains(" 200 ", StringComparison.Ordinal) ? "Healthy" : "Unhealthy";
        var response = $"{statusLine}\r\nContent-Type: text/plain\r\nContent-Length: {body.Length}\r\nConnection: close\r\n\r\n{body}";
        await stream.WriteAsync(Encoding.ASCII.GetBytes(response));
        return requestLine;
    }
}
