using System.Security.Cryptography.X509Certificates;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Security;

/// <summary>The site-CA check for client certificates, with certificates made by a throwaway CA of the test.</summary>
public sealed class ClientCertificateTrustTests : IDisposable
{
    private readonly string _directory = Directory.CreateTempSubdirectory("geldispense-ca-").FullName;
    private readonly SiteAuthority _site = new("GelDispense test site CA");

    [Fact]
    public void Without_a_configured_file_there_is_no_site_trust_and_Kestrel_keeps_its_own_check() =>
        Assert.Null(ClientCertificateTrust.From(new AuthSettings(), _directory));

    [Theory]
    [InlineData("pem")]
    [InlineData("der")]
    public void A_station_certificate_of_the_site_CA_is_admitted_and_others_are_not(string format)
    {
        var file = Path.Combine(_directory, "site-ca." + format);
        if (format == "pem")
        {
            File.WriteAllText(file, _site.Certificate.ExportCertificatePem());
        }
        else
        {
            File.WriteAllBytes(file, _site.Certificate.Export(X509ContentType.Cert));
        }

        var trust = ClientCertificateTrust.From(new AuthSettings { ClientCertificateCaFile = file }, _directory)!;
        using var station = _site.IssueClient("bay-3");
        using var rogue = new SiteAuthority("rogue CA");
        using var rogueStation = rogue.IssueClient("bay-3");
        // A server certificate of the same CA lacks id-kp-clientAuth (RFC 5280 §4.2.1.12), so it may not log in.
        using var server = _site.IssueServer();

        Assert.True(trust.Admits(station));
        Assert.False(trust.Admits(rogueStation));
        Assert.False(trust.Admits(server));
    }

    [Fact]
    public void A_missing_file_stops_the_start_naming_the_key_and_the_path()
    {
        var missing = Path.Combine(_directory, "nowhere.pem");
        var refused = Assert.Throws<InvalidOperationException>(() =>
            ClientCertificateTrust.From(new AuthSettings { ClientCertificateCaFile = missing }, _directory));
        Assert.Equal($"Auth:ClientCertificateCaFile = {missing}: no such file", refused.Message);
    }

    [Fact]
    public void A_file_that_holds_no_certificate_stops_the_start_naming_the_key_and_the_reason()
    {
        var garbage = Path.Combine(_directory, "site-ca.pem");
        File.WriteAllText(garbage, "not a certificate");
        var refused = Assert.Throws<InvalidOperationException>(() =>
            ClientCertificateTrust.From(new AuthSettings { ClientCertificateCaFile = "site-ca.pem" }, _directory));
        Assert.StartsWith($"Auth:ClientCertificateCaFile = {garbage}: not a PEM or DER certificate file", refused.Message, StringComparison.Ordinal);
    }

    public void Dispose()
    {
        _site.Dispose();
        Directory.Delete(_directory, recursive: true);
    }
}
