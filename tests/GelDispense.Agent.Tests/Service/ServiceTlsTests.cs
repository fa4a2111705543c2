using System.Net.Security;
using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;
using GelDispense.Agent.Configuration;
using GelDispense.Agent.Service;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Tests.Service;

/// <summary>The "service" TLS section: config checks name the field, and the server certificate must chain to the site CA.</summary>
public sealed class ServiceTlsTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("geldispense-tls-").FullName;

    [Fact]
    public void Certificate_settings_are_refused_by_field_when_a_file_is_missing_the_address_is_plain_http_or_a_password_stands_alone()
    {
        var config = Parse("http://127.0.0.1:5081", $$"""{ "caCertificateFile": "{{Path.Combine(_dir, "none.pem")}}", "clientCertificatePassword": "pw" }""");

        var errors = Assert.Throws<InvalidInputException>(() => BalanceSetup.From(config)).Errors.Select(e => e.Field).ToList();

        Assert.Contains("service", errors);
        Assert.Contains("service.caCertificateFile", errors);
        Assert.Contains("service.clientCertificatePassword", errors);
    }

    [Fact]
    public void A_client_certificate_with_a_wrong_password_is_refused_and_with_the_right_one_is_presented()
    {
        using var ca = NewCa("GelDispense test site CA");
        var caFile = Path.Combine(_dir, "ca.pem");
        File.WriteAllText(caFile, ca.ExportCertificatePem());
        using var client = Issue(ca, "bay-3");
        var pfx = Path.Combine(_dir, "bay-3.pfx");
        File.WriteAllBytes(pfx, client.Export(X509ContentType.Pkcs12, "s3cret"));

        var wrong = Parse("https://service.lab.test:5081", $$"""{ "caCertificateFile": "{{caFile}}", "clientCertificateFile": "{{pfx}}", "clientCertificatePassword": "nope" }""");
        var refusal = Assert.Single(Assert.Throws<InvalidInputException>(() => BalanceSetup.From(wrong)).Errors);
        Assert.Equal("service.clientCertificateFile", refusal.Field);

        var right = Parse("https://service.lab.test:5081", $$"""{ "caCertificateFile": "{{caFile}}", "clientCertificateFile": "{{pfx}}", "clientCertificatePassword": "s3cret" }""");
        _ = BalanceSetup.From(right);
        var options = ServiceTls.Options(right.Service)!;
        var presented = Assert.IsType<X509Certificate2>(Assert.Single(options.ClientCertificates!));
        Assert.True(presented.HasPrivateKey);
        Assert.Equal(client.Thumbprint, presented.Thumbprint);
        Assert.NotNull(options.RemoteCertificateValidationCallback);
    }

    [Fact]
    public void Only_a_server_certificate_from_the_site_CA_with_a_matching_name_is_trusted()
    {
        using var ca = NewCa("GelDispense test site CA");
        using var other = NewCa("Some other CA");
        using var ours = Issue(ca, "service.lab.test");
        using var theirs = Issue(other, "service.lab.test");

        Assert.True(ServiceTls.Trusted(ca, ours, SslPolicyErrors.RemoteCertificateChainErrors));
        Assert.False(ServiceTls.Trusted(ca, theirs, SslPolicyErrors.RemoteCertificateChainErrors));
        Assert.False(ServiceTls.Trusted(ca, ours, SslPolicyErrors.RemoteCertificateChainErrors | SslPolicyErrors.RemoteCertificateNameMismatch));
        Assert.False(ServiceTls.Trusted(ca, null, SslPolicyErrors.RemoteCertificateNotAvailable));
    }

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static StationConfig Parse(string address, string service) =>
        StationConfigLoader.Parse($$"""{ "serviceAddress": "{{address}}", "balance": { "port": "/dev/ttyS9" }, "service": {{service}} }""");

    private static X509Certificate2 NewCa(string name)
    {
        using var key = ECDsa.Create(ECCurve.NamedCurves.nistP256);
        var request = new CertificateRequest($"CN={name}", key, HashAlgorithmName.SHA256);
        request.CertificateExtensions.Add(new X509BasicConstraintsExtension(true, false, 0, true));
        request.CertificateExtensions.Add(new X509KeyUsageExtension(X509KeyUsageFlags.KeyCertSign, true));
        return request.CreateSelfSigned(DateTimeOffset.UtcNow.AddDays(-1), DateTimeOffset.UtcNow.AddDays(30));
    }

    private static X509Certificate2 Issue(X509Certificate2 ca, string name)
    {
        using var key = ECDsa.Create(ECCurve.NamedCurves.nistP256);
        var request = new CertificateRequest($"CN={name}", key, HashAlgorithmName.SHA256);
        var san = new SubjectAlternativeNameBuilder();
        san.AddDnsName(name);
        request.CertificateExtensions.Add(san.Build());
        using var issued = request.Create(ca, DateTimeOffset.UtcNow.AddHours(-1), DateTimeOffset.UtcNow.AddDays(7), RandomNumberGenerator.GetBytes(8));
        return issued.CopyWithPrivateKey(key);
    }
}
