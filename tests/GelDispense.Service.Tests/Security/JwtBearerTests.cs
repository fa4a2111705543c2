using System.Net.Http.Headers;
using System.Security.Claims;
using System.Security.Cryptography;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;
using Grpc.Net.Client;
using Microsoft.IdentityModel.Tokens;

namespace GelDispense.Service.Tests.Security;

/// <summary>
/// Sites with an identity provider: the service on real sockets with <c>Auth:Jwt</c> pointing at a local OpenID Connect
/// issuer, whose metadata and signing keys it fetches over HTTP. Tokens carry "role" and, for stations, "station_id",
/// and pass through the same policies and station scope as API keys; API keys keep working beside them.
/// </summary>
public sealed class JwtBearerTests : IAsyncLifetime
{
    private const string Audience = "geldispense";

    private LocalIssuer _issuer = null!;
    private KestrelHost _host = null!;

    public async Task InitializeAsync()
    {
        _issuer = await LocalIssuer.StartAsync();
        _host = await KestrelHost.StartAsync(new Dictionary<string, string>
        {
            ["Auth:Jwt:Authority"] = _issuer.Address,
            ["Auth:Jwt:Audience"] = Audience,
            ["Auth:Jwt:RequireHttpsMetadata"] = "false",
        });
    }

    public async Task DisposeAsync()
    {
        await _host.DisposeAsync();
        await _issuer.DisposeAsync();
    }

    [Fact]
    public async Task A_lims_token_from_the_site_issuer_reads_over_REST_and_gRPC_but_may_not_plan()
    {
        var token = _issuer.Token(Audience, [new("sub", "lims-sync"), new(GelDispenseClaims.Role, Roles.Lims)]);

        await Demo.GetAsync(Rest(token), "/v1/batches");
        await Demo.PostAsync(Rest(token), "/v1/plans", $$"""{"recipe":{{Demo.Recipe}},"balance":{{Demo.Balance}}}""", 403);
        using var channel = GrpcChannel.ForAddress($"http://127.0.0.1:{_host.GrpcPort}");
        var headers = new Metadata { { "authorization", $"Bearer {token}" } };
        var page = await new BatchService.BatchServiceClient(channel).ListBatchesAsync(new ListBatchesRequest(), headers);
        Assert.NotNull(page);
        var refused = await Assert.ThrowsAsync<RpcException>(() => new PlanService.PlanServiceClient(channel).CreatePlanAsync(new CreatePlanRequest(), headers).ResponseAsync);
        Assert.Equal(StatusCode.PermissionDenied, refused.StatusCode);
    }

    [Fact]
    public async Task A_station_token_starts_its_own_stations_batch_records_its_subject_as_actor_and_is_refused_for_another_station()
    {
        var token = _issuer.Token(Audience, [new("sub", "tech-ines"), new(GelDispenseClaims.Role, Roles.Station), new(GelDispenseClaims.StationId, "bay-7")]);

        var batch = await Demo.StartBatchAsync(Rest(token), "bay-7");
        await Demo.PostAsync(Rest(token), "/v1/batches", $$"""{"stationId":"bay-8","recipe":{{Demo.Recipe}},"balance":{{Demo.Balance}}}""", 403);

        var step = batch["steps"]![0]!;
        var readingG = (double)step["targetReadingG"]!;
        await Demo.PostAsync(Rest(token), $"/v1/batches/{batch["id"]}/additions", Demo.Addition("jwt-1", (int)step["index"]!, readingG));
        var corrected = await Demo.PostAsync(Rest(token), $"/v1/batches/{batch["id"]}/additions/jwt-1:correct",
            $$"""{"correctionId":"jwt-c1","readingG":{{readingG + 0.001}},"reason":"reading keyed from the balance print-out"}""");
        Assert.Equal("tech-ines", (string)corrected["correction"]!["actorKeyId"]!);
    }

    [Fact]
    public async Task Forged_expired_wrong_audience_and_malformed_tokens_are_refused_with_401_while_an_API_key_still_works()
    {
        Claim[] claims = [new("sub", "lims-sync"), new(GelDispenseClaims.Role, Roles.Lims)];
        string[] refused =
        [
            _issuer.Token(Audience, claims, signWith: new RsaSecurityKey(RSA.Create(2048)) { KeyId = "site-key-1" }),
            _issuer.Token(Audience, claims, expires: DateTime.UtcNow.AddMinutes(-10)),
            _issuer.Token("another-service", claims),
            "eyJhbGciOiJub25lIn0.eyJzdWIiOiJ4In0.",
        ];

        foreach (var token in refused)
        {
            await Demo.GetAsync(Rest(token), "/v1/batches", 401);
        }

        await Demo.GetAsync(Rest(await _host.IssueKeyAsync(Roles.Lims)), "/v1/batches");
    }

    private HttpClient Rest(string bearer) => new()
    {
        BaseAddress = new Uri($"http://127.0.0.1:{_host.RestPort}"),
        DefaultRequestHeaders = { Authorization = new AuthenticationHeaderValue("Bearer", bearer) },
    };
}
