using System.Net;
using System.Net.Http.Headers;
using System.Net.Security;
using System.Security.Cryptography.X509Certificates;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;
using Grpc.Net.Client;

namespace GelDispense.Service.Tests.Extensions;

/// <summary>
/// HTTPS configured exactly as the README's "HTTPS on both endpoints" section shows it: Rest with a PKCS#12 file and
/// password on Http1AndHttp2, Grpc with a PEM certificate and key file on Http2, and for client certificates
/// ClientCertificateMode with the site CA file. Clients trust only the test's own CA; nothing is bypassed.
/// </summary>
[System.Runtime.Versioning.UnsupportedOSPlatform("windows")]
public sealed class KestrelHttpsTests : IDisposable
{
    private const string PfxPassword = "pfx-pass-for-this-test";
    private readonly string _directory = Directory.CreateTempSubdirectory("geldispense-tls-").FullName;
    private readonly SiteAuthority _site = new("GelDispense test site CA");

    [Fact]
    public async Task REST_and_gRPC_calls_over_TLS_validate_the_server_certificate_against_the_site_CA()
    {
        await using var host = await KestrelHost.StartAsync(ServerSettings(), scheme: "https");
        var admin = await host.IssueKeyAsync(Roles.Admin);
        var rest = new HttpClient(Trusting(_site.Certificate)) { BaseAddress = new Uri($"https://127.0.0.1:{host.RestPort}") };
        rest.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", admin);

        using (var batches = await rest.GetAsync("/v1/batches"))
        {
            Assert.Equal(HttpStatusCode.OK, batches.StatusCode);
        }

        Assert.Equal(StatusCode.OK, await ListBatchesAsync($"https://127.0.0.1:{host.GrpcPort}", Trusting(_site.Certificate), admin));
        // With TLS, ALPN lets the Rest endpoint (Http1AndHttp2) serve gRPC too.
        Assert.Equal(StatusCode.OK, await ListBatchesAsync($"https://127.0.0.1:{host.RestPort}", Trusting(_site.Certificate), admin));

        // A client that trusts another CA refuses the server: the check above is a real one.
        using var other = new SiteAuthority("some other CA");
        using var stranger = new HttpClient(Trusting(other.Certificate));
        var refused = await Assert.ThrowsAsync<HttpRequestException>(() => stranger.GetAsync($"https://127.0.0.1:{host.RestPort}/healthz"));
        Assert.IsType<System.Security.Authentication.AuthenticationException>(refused.InnerException);
    }

    [Fact]
    public async Task With_a_required_client_certificate_only_a_station_certificate_of_the_site_CA_is_admitted()
    {
        var caFile = Path.Combine(_directory, "site-ca.pem");
        await File.WriteAllTextAsync(caFile, _site.Certificate.ExportCertificatePem());
        var settings = ServerSettings();
        settings["Kestrel:Endpoints:Grpc:ClientCertificateMode"] = "RequireCertificate";
        settings["Auth:ClientCertificateCaFile"] = caFile;
        await using var host = await KestrelHost.StartAsync(settings, scheme: "https");
        var station = await host.IssueKeyAsync(Roles.Lims);
        var address = $"https://127.0.0.1:{host.GrpcPort}";
        using var siteClient = _site.IssueClient("bay-3");
        using var rogue = new SiteAuthority("rogue CA");
        using var rogueClient = rogue.IssueClient("bay-3");

        Assert.Equal(StatusCode.OK, await ListBatchesAsync(address, Trusting(_site.Certificate, siteClient), station));
        Assert.NotEqual(StatusCode.OK, await ListBatchesAsync(address, Trusting(_site.Certificate), station));
        Assert.NotEqual(StatusCode.OK, await ListBatchesAsync(address, Trusting(_site.Certificate, rogueClient), station));
        // The Rest endpoint asks for no certificate, as configured.
        using var rest = new HttpClient(Trusting(_site.Certificate));
        using var health = await rest.GetAsync($"https://127.0.0.1:{host.RestPort}/healthz");
        Assert.Equal(HttpStatusCode.OK, health.StatusCode);
    }

    public void Dispose()
    {
        _site.Dispose();
        Directory.Delete(_directory, recursive: true);
    }

    /// <summary>The README's endpoint shape, with the files written from a server certificate of the test's CA.</summary>
    private Dictionary<string, string> ServerSettings()
    {
        using var server = _site.IssueServer();
        var pfx = Path.Combine(_directory, "service.pfx");
        var crt = Path.Combine(_directory, "service.crt");
        var key = Path.Combine(_directory, "service.key");
        File.WriteAllBytes(pfx, server.Export(X509ContentType.Pkcs12, PfxPassword));
        File.WriteAllText(crt, server.ExportCertificatePem());
        File.WriteAllText(key, server.GetECDsaPrivateKey()!.ExportPkcs8PrivateKeyPem());
        File.SetUnixFileMode(key, UnixFileMode.UserRead | UnixFileMode.UserWrite);
        return new Dictionary<string, string>
        {
            ["Kestrel:Endpoints:Rest:Protocols"] = "Http1AndHttp2",
            ["Kestrel:Endpoints:Rest:Certificate:Path"] = pfx,
            ["Kestrel:Endpoints:Rest:Certificate:Password"] = PfxPassword,
            ["Kestrel:Endpoints:Grpc:Protocols"] = "Http2",
            ["Kestrel:Endpoints:Grpc:Certificate:Path"] = crt,
            ["Kestrel:Endpoints:Grpc:Certificate:KeyPath"] = key,
        };
    }

    private static async Task<StatusCode> ListBatchesAsync(string address, HttpMessageHandler handler, string key)
    {
        using var channel = GrpcChannel.ForAddress(address, new GrpcChannelOptions { HttpHandler = handler, DisposeHttpClient = true });
        try
        {
            await new BatchService.BatchServiceClient(channel).ListBatchesAsync(
                new ListBatchesRequest(), new Metadata { { "Authorization", "Bearer " + key } }, DateTime.UtcNow.AddSeconds(20));
            return StatusCode.OK;
        }
        catch (RpcException e)
        {
            return e.StatusCode;
        }
    }

    /// <summary>A handler that trusts only <paramref name="authority"/> for the server and may present a client certificate.</summary>
    private static SocketsHttpHandler Trusting(X509Certificate2 authority, X509Certificate2? clientCertificate = null)
    {
        var policy = new X509ChainPolicy { TrustMode = X509ChainTrustMode.CustomRootTrust, RevocationMode = X509RevocationMode.NoCheck };
        policy.CustomTrustStore.Add(authority);
        var ssl = new SslClientAuthenticationOptions { CertificateChainPolicy = policy };
        if (clientCertificate is not null)
        {
            ssl.ClientCertificates = [clientCertificate];
        }

        return new SocketsHttpHandler { SslOptions = ssl };
    }
}
