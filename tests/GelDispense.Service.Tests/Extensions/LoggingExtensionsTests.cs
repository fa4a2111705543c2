using GelDispense.Service.Tests.Infrastructure;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using Serilog.Core;

namespace GelDispense.Service.Tests.Extensions;

/// <summary>
/// Each host logs through its own Serilog logger, so two hosts in one process (the agent's demo, parallel tests) never
/// take over each other's lines, and the one-line-per-request log reaches the host's sinks.
/// </summary>
[Collection(ApiCollection.Name)]
public sealed class LoggingExtensionsTests(ApiHosts hosts)
{
    [Theory, SqliteEngine]
    public async Task Each_request_is_logged_once_to_its_own_hosts_sinks_while_another_host_runs_in_the_same_process(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var (first, second) = (new CapturedLog(), new CapturedLog());
        // The suite logs at Warning; a request line is Information.
        await using var one = host.WithWebHostBuilder(b => b.UseSetting("Serilog:MinimumLevel:Default", "Information")
            .ConfigureTestServices(s => s.AddSingleton<ILogEventSink>(first)));
        await using var two = host.WithWebHostBuilder(b => b.ConfigureTestServices(s => s.AddSingleton<ILogEventSink>(second)));
        using var client = one.CreateClient();
        _ = two.Services;

        (await client.GetAsync("/v1/reagents/teos")).EnsureSuccessStatusCode();

        Assert.Single(first.Messages, m => m.Contains("GET", StringComparison.Ordinal) && m.Contains("/v1/reagents/teos", StringComparison.Ordinal) && m.Contains("-> 200", StringComparison.Ordinal));
        Assert.DoesNotContain(second.Messages, m => m.Contains("/v1/reagents/teos", StringComparison.Ordinal));
    }
}
