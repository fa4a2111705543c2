using System.Net;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;

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
    public async Task A_revoked_key_is_refused_and_an_expired_key_is_refused(string engine)
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

        var expiring = await host.IssueKeyAsync(Roles.Lims, expiresAt: DateTimeOffset.UtcNow.AddMilliseconds(300));
        await Task.Delay(600);
        using var expired = await host.ClientWith(expiring).GetAsync("/v1/batches");
        Assert.Equal(HttpStatusCode.Unauthorized, expired.StatusCode);
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
}
