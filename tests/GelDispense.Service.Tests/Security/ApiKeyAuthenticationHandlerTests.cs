using System.Net;
using System.Net.Http.Headers;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;
using Grpc.Net.Client;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Time.Testing;
using Serilog.Core;

namespace GelDispense.Service.Tests.Security;

[Collection(ApiCollection.Name)]
public sealed class ApiKeyAuthenticationHandlerTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_call_without_credentials_is_401_over_REST_and_UNAUTHENTICATED_over_gRPC(string engine)
    {
        var host = await hosts.ForAsync(engine);
        using var response = await host.AnonymousClient().GetAsync("/v1/batches");
        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);

        var client = new BatchService.BatchServiceClient(host.Channel(key: null));
        var refused = await Assert.ThrowsAsync<RpcException>(() => client.ListBatchesAsync(new ListBatchesRequest()).ResponseAsync);
        Assert.Equal(StatusCode.Unauthenticated, refused.StatusCode);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Health_and_ping_answer_without_credentials(string engine)
    {
        var host = await hosts.ForAsync(engine);
        using var health = await host.AnonymousClient().GetAsync("/healthz");
        Assert.Equal(HttpStatusCode.OK, health.StatusCode);
        await Demo.PostAsync(host.AnonymousClient(), "/v1/ping", "{}");
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Malformed_authorization_headers_are_refused_with_401_never_a_server_error(string engine)
    {
        var host = await hosts.ForAsync(engine);
        string[] headers =
        [
            "", "Bearer", "Bearer ", "Basic dXNlcjpwYXNz", "bearer gdk_", "Bearer gdk_" + new string('A', 43),
            "Bearer " + new string('x', 16_000), "Bearer \u00ff\u00fe\u0001\u0002", "Bearer gdk_" + new string('\u00e9', 43),
            "Token abc", "Bearer a b c",
        ];
        foreach (var header in headers)
        {
            using var request = new HttpRequestMessage(HttpMethod.Get, "/v1/batches");
            request.Headers.TryAddWithoutValidation("Authorization", header);
            using var response = await host.AnonymousClient().SendAsync(request);
            Assert.True(response.StatusCode == HttpStatusCode.Unauthorized, $"'{header[..Math.Min(header.Length, 40)]}' gave {(int)response.StatusCode}");
        }
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_revoked_key_is_refused(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var admin = host.CreateClient();
        var issued = await Demo.PostAsync(admin, "/v1/api-keys", """{"role":"lims","label":"revocation test"}""");
        var key = (string)issued["key"]!;
        using (var before = await host.ClientWith(key).GetAsync("/v1/batches"))
        {
            Assert.Equal(HttpStatusCode.OK, before.StatusCode);
        }

        await Demo.PostAsync(admin, $"/v1/api-keys/{issued["apiKey"]!["id"]}:revoke", "{}");
        using (var after = await host.ClientWith(key).GetAsync("/v1/batches"))
        {
            Assert.Equal(HttpStatusCode.Unauthorized, after.StatusCode);
        }
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_revoked_key_is_refused_at_once_by_the_revoking_replica_and_one_without_key_cache_and_by_a_caching_replica_once_its_period_has_passed(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var (revoking, revokingClock) = Replica(host, cacheSeconds: 2);
        var (caching, cachingClock) = Replica(host, cacheSeconds: 2);
        var (uncached, _) = Replica(host, cacheSeconds: 0);
        await using var revokingReplica = revoking;
        await using var cachingReplica = caching;
        await using var uncachedReplica = uncached;
        var issued = await revoking.Services.GetRequiredService<ApiKeyIssuer>().IssueAsync(Roles.Lims, "", null, "key cache test", CancellationToken.None);
        foreach (var replica in new[] { revoking, caching, uncached })
        {
            Assert.Equal(HttpStatusCode.OK, await ListStatusAsync(replica, issued.Key));
        }

        await Demo.PostAsync(ClientOf(revoking, host.AdminKey), $"/v1/api-keys/{issued.Row.Id}:revoke", "{}");
        Assert.Equal(HttpStatusCode.Unauthorized, await ListStatusAsync(revoking, issued.Key));
        Assert.Equal(HttpStatusCode.Unauthorized, await ListStatusAsync(uncached, issued.Key));

        // The trade of the cache: a replica that read the key before the revocation may reuse it for 2 s of its clock.
        cachingClock.Advance(TimeSpan.FromSeconds(1.9));
        Assert.Equal(HttpStatusCode.OK, await ListStatusAsync(caching, issued.Key));
        cachingClock.Advance(TimeSpan.FromSeconds(0.1));
        Assert.Equal(HttpStatusCode.Unauthorized, await ListStatusAsync(caching, issued.Key));
        revokingClock.Advance(TimeSpan.FromMinutes(5));
        Assert.Equal(HttpStatusCode.Unauthorized, await ListStatusAsync(revoking, issued.Key));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_key_is_refused_once_the_service_clock_passes_its_expiry_and_the_refusal_is_logged_without_the_secret(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var clock = new FakeTimeProvider(DateTimeOffset.UtcNow);
        var log = new CapturedLog();
        await using var factory = host.WithWebHostBuilder(b => b.ConfigureTestServices(s => s
            .AddSingleton<TimeProvider>(clock)
            .AddSingleton<ILogEventSink>(log)));
        var issued = await factory.Services.GetRequiredService<ApiKeyIssuer>()
            .IssueAsync(Roles.Lims, "", clock.GetUtcNow().AddHours(1), "expiry test", CancellationToken.None);
        using var rest = factory.CreateDefaultClient();
        rest.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", issued.Key);
        var grpc = new BatchService.BatchServiceClient(GrpcChannel.ForAddress(factory.Server.BaseAddress, new GrpcChannelOptions { HttpHandler = factory.Server.CreateHandler() }));
        var credentials = new Metadata { { "Authorization", "Bearer " + issued.Key } };

        clock.Advance(TimeSpan.FromMinutes(59));
        using (var valid = await rest.GetAsync("/v1/batches"))
        {
            Assert.Equal(HttpStatusCode.OK, valid.StatusCode);
        }

        await grpc.ListBatchesAsync(new ListBatchesRequest(), credentials);

        clock.Advance(TimeSpan.FromMinutes(1) + TimeSpan.FromSeconds(1));
        using (var expired = await rest.GetAsync("/v1/batches"))
        {
            Assert.Equal(HttpStatusCode.Unauthorized, expired.StatusCode);
        }

        var refused = await Assert.ThrowsAsync<RpcException>(() => grpc.ListBatchesAsync(new ListBatchesRequest(), credentials).ResponseAsync);
        Assert.Equal(StatusCode.Unauthenticated, refused.StatusCode);

        var refusals = log.Messages.Where(m => m.Contains($"key {issued.Row.Id} expired", StringComparison.Ordinal)).ToList();
        Assert.Equal(2, refusals.Count);
        Assert.DoesNotContain(log.Messages, m => m.Contains(issued.Key[ApiKeySecret.Marker.Length..], StringComparison.Ordinal));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Listing_keys_never_returns_a_secret(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var issued = await Demo.PostAsync(host.CreateClient(), "/v1/api-keys", """{"role":"formulator"}""");
        var secret = (string)issued["key"]!;
        using var listed = await host.CreateClient().GetAsync("/v1/api-keys");
        var body = await listed.Content.ReadAsStringAsync();
        Assert.Contains((string)issued["apiKey"]!["id"]!, body, StringComparison.Ordinal);
        Assert.DoesNotContain(secret[ApiKeySecret.Marker.Length..], body, StringComparison.Ordinal);
    }

    // Another service process on the host's database, with its own key cache and its own stopped clock.
    private static (WebApplicationFactory<Program> Replica, FakeTimeProvider Clock) Replica(ServiceHost host, int cacheSeconds)
    {
        var clock = new FakeTimeProvider(DateTimeOffset.UtcNow);
        var replica = host.WithWebHostBuilder(b => b
            .UseSetting("Auth:KeyCacheSeconds", cacheSeconds.ToString(System.Globalization.CultureInfo.InvariantCulture))
            .ConfigureTestServices(s => s.AddSingleton<TimeProvider>(clock)));
        return (replica, clock);
    }

    private static HttpClient ClientOf(WebApplicationFactory<Program> replica, string key)
    {
        var client = replica.CreateDefaultClient();
        client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", key);
        return client;
    }

    private static async Task<HttpStatusCode> ListStatusAsync(WebApplicationFactory<Program> replica, string key)
    {
        using var response = await ClientOf(replica, key).GetAsync("/v1/batches");
        return response.StatusCode;
    }
}
