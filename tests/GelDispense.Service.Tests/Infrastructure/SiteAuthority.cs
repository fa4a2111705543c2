using System.Net;
using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>
/// A throwaway certificate authority made in memory for one test: it issues a server certificate for 127.0.0.1
/// and station client certificates. ECDSA P-256 keys; nothing touches a certificate store.
/// </summary>
public sealed class SiteAuthority : IDisposable
{
    // RFC 5280 §4.2.1.12: id-kp-serverAuth and id-kp-clientAuth.
    private const string ServerAuthOid = "1.3.6.1.5.5.7.3.1";
    private const string ClientAuthOid = "1.3.6.1.5.5.7.3.2";
    private readonly ECDsa _key = ECDsa.Create(ECCurve.NamedCurves.nistP256);

    public SiteAuthority(string name)
    {
        var request = new CertificateRequest($"CN={name}", _key, HashAlgorithmName.SHA256);
        request.CertificateExtensions.Add(new X509BasicConstraintsExtension(true, false, 0, true));
        request.CertificateExtensions.Add(new X509KeyUsageExtension(X509KeyUsageFlags.KeyCertSign | X509KeyUsageFlags.CrlSign, true));
        request.CertificateExtensions.Add(new X509SubjectKeyIdentifierExtension(request.PublicKey, false));
        Certificate = request.CreateSelfSigned(DateTimeOffset.UtcNow.AddHours(-1), DateTimeOffset.UtcNow.AddDays(1));
    }

    public X509Certificate2 Certificate { get; }

    /// <summary>A certificate with its private key for the server at 127.0.0.1 (and localhost).</summary>
    public X509Certificate2 IssueServer()
    {
        var names = new SubjectAlternativeNameBuilder();
        names.AddIpAddress(IPAddress.Loopback);
        names.AddDnsName("localhost");
        return Issue("CN=geldispense-service", ServerAuthOid, names.Build());
    }

    /// <summary>A client certificate with its private key for a station.</summary>
    public X509Certificate2 IssueClient(string stationId) => Issue($"CN={stationId}", ClientAuthOid, null);

    public void Dispose()
    {
        Certificate.Dispose();
        _key.Dispose();
    }

    private X509Certificate2 Issue(string subject, string usageOid, X509Extension? names)
    {
        using var key = ECDsa.Create(ECCurve.NamedCurves.nistP256);
        var request = new CertificateRequest(subject, key, HashAlgorithmName.SHA256);
        request.CertificateExtensions.Add(new X509BasicConstraintsExtension(false, false, 0, true));
        request.CertificateExtensions.Add(new X509KeyUsageExtension(X509KeyUsageFlags.DigitalSignature, true));
        request.CertificateExtensions.Add(new X509EnhancedKeyUsageExtension([new Oid(usageOid)], false));
        request.CertificateExtensions.Add(X509AuthorityKeyIdentifierExtension.CreateFromCertificate(Certificate, true, false));
        if (names is not null)
        {
            request.CertificateExtensions.Add(names);
        }

        var serial = RandomNumberGenerator.GetBytes(12);
        using var issued = request.Create(Certificate, DateTimeOffset.UtcNow.AddMinutes(-30), DateTimeOffset.UtcNow.AddHours(12), serial);
        using var withKey = issued.CopyWithPrivateKey(key);
        // Through PKCS#12 so the key is a persisted one that TLS on every platform accepts.
        return X509CertificateLoader.LoadPkcs12(withKey.Export(X509ContentType.Pkcs12), null);
    }
}
