using System.Net;
using System.Net.Http.Headers;
using GelDispense.Service.Tests.Infrastructure;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.DependencyInjection;
using Serilog.Core;

namespace GelDispense.Service.Tests.Security;

/// <summary>
/// The first start on an empty database: the bootstrap admin key lands in the configured file (or beside the SQLite
/// database), owner-only, the key in it is accepted, and the log names the file but never the key.
/// </summary>
// Unix file modes: the owner-only check has no meaning on Windows, where ACLs guard the file.
[Collection(ApiCollection.Name), System.Runtime.Versioning.UnsupportedOSPlatform("windows")]
public sealed class BootstrapKeyHostedServiceTests(ApiHosts hosts)
{
    [Fact]
    public async Task The_first_start_writes_a_working_admin_key_owner_only_to_the_configured_file_and_logs_its_path()
    {
        await using var host = await hosts.ServiceHostOnNewDatabaseAsync("Sqlite");
        var log = new CapturedLog();
        await using var factory = host.WithWebHostBuilder(b => b.ConfigureServices(s => s.AddSingleton<ILogEventSink>(log)));
        await AssertBootstrapAsync(factory, host.BootstrapKeyFile, log);
    }

    [Fact]
    public async Task Without_a_configured_file_the_key_is_written_beside_the_SQLite_database()
    {
        await using var host = await hosts.ServiceHostOnNewDatabaseAsync("Sqlite");
        var log = new CapturedLog();
        await using var factory = host.WithWebHostBuilder(b => b
            .UseSetting("Auth:BootstrapKeyFile", "")
            .ConfigureServices(s => s.AddSingleton<ILogEventSink>(log)));
        var expected = Path.Combine(Path.GetDirectoryName(new SqliteConnectionStringBuilder(host.ConnectionString).DataSource)!, "admin.key");
        await AssertBootstrapAsync(factory, expected, log);
    }

    private static async Task AssertBootstrapAsync(WebApplicationFactory<Program> factory, string path, CapturedLog log)
    {
        using var anonymous = new HttpClient(factory.Server.CreateHandler()) { BaseAddress = factory.Server.BaseAddress };
        Assert.True(File.Exists(path), $"no key file at {path}");
        // Owner read and write only (mode 0600): common practice for secrets on Unix.
        Assert.Equal(UnixFileMode.UserRead | UnixFileMode.UserWrite, File.GetUnixFileMode(path));

        var key = (await File.ReadAllTextAsync(path)).Trim();
        anonymous.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", key);
        using var keys = await anonymous.GetAsync("/v1/api-keys");
        Assert.Equal(HttpStatusCode.OK, keys.StatusCode);
        anonymous.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", key[..^1] + (key[^1] == 'A' ? 'B' : 'A'));
        using var refused = await anonymous.GetAsync("/v1/api-keys");
        Assert.Equal(HttpStatusCode.Unauthorized, refused.StatusCode);

        var lines = log.Messages.ToList();
        Assert.Contains(lines, m => m.Contains(path, StringComparison.Ordinal));
        Assert.DoesNotContain(lines, m => m.Contains(key, StringComparison.Ordinal));
    }
}
