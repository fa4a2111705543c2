using System.Net.Security;
using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;
using GelDispense.Agent.Configuration;

namespace GelDispense.Agent.Service;

/// <summary>
/// The TLS options of the channel to the service: the server certificate judged against the site CA when one is
/// configured (else the system trust store, the handler's default), and the station's client certificate.
/// </summary>
public static class ServiceTls
{
    /// <summary>Null when the config asks for nothing beyond the defaults.</summary>
    public static SslClientAuthenticationOptions? Options(ServiceTlsConfig? config)
    {
        if (config is null || (config.CaCertificateFile is null && config.ClientCertificateFile is null))
        {
            return null;
        }

        var options = new SslClientAuthenticationOptions();
        if (config.CaCertificateFile is { } caFile)
        {
            var ca = LoadCa(caFile);
            options.RemoteCertificateValidationCallback = (_, presented, _, errors) => Trusted(ca, presented, errors);
        }

        if (config.ClientCertificateFile is { } clientFile)
        {
            options.ClientCertificates = [LoadClient(clientFile, config.ClientCertificatePassword)];
        }

        return options;
    }

    /// <summary>
    /// Accepts the server certificate only if it chains to <paramref name="ca"/>. A missing certificate or a host name
    /// mismatch is refused whatever the chain: only the chain's root is judged differently from the default.
    /// </summary>
    public static bool Trusted(X509Certificate2 ca, X509Certificate? presented, SslPolicyErrors errors)
    {
        if (presented is null || (errors & ~SslPolicyErrors.RemoteCertificateChainErrors) != SslPolicyErrors.None)
        {
            return false;
        }

        using var chain = new X509Chain();
        chain.ChainPolicy.TrustMode = X509ChainTrustMode.CustomRootTrust;
        chain.ChainPolicy.CustomTrustStore.Add(ca);
        // A site CA for one lab seldom runs a revocation service; a compromised server certificate is replaced, and the
        // old one dies with the CA being reissued.
        chain.ChainPolicy.RevocationMode = X509RevocationMode.NoCheck;
        using var leaf = X509CertificateLoader.LoadCertificate(presented.GetRawCertData());
        return chain.Build(leaf);
    }

    /// <summary>A single certificate, PEM or DER.</summary>
    public static X509Certificate2 LoadCa(string path) => X509CertificateLoader.LoadCertificateFromFile(path);

    /// <summary>A PKCS#12 file that must hold the private key, or the server could never accept it.</summary>
    public static X509Certificate2 LoadClient(string path, string? password)
    {
        var certificate = X509CertificateLoader.LoadPkcs12FromFile(path, password);
        if (!certificate.HasPrivateKey)
        {
            certificate.Dispose();
            throw new InvalidDataException("the file holds a certificate without its private key");
        }

        return certificate;
    }

    /// <summary>Why a certificate file cannot be used, or null when it loads.</summary>
    public static string? Refusal(Func<X509Certificate2> load)
    {
        try
        {
            load().Dispose();
            return null;
        }
        catch (Exception e) when (e is CryptographicException or IOException or UnauthorizedAccessException or InvalidDataException)
        {
            return $"cannot be used: {e.Message}";
        }
    }
}
