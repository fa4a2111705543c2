using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;

namespace GelDispense.Service.Security;

/// <summary>
/// Judges station client certificates against the site CA named by <c>Auth:ClientCertificateCaFile</c> instead of
/// the machine trust store, where every public CA would vouch for a client. The chain must end at one of the file's
/// certificates and the leaf must allow client authentication. Revocation is not checked: a site CA publishes no
/// revocation list, and a lost station is shut out by revoking its API key, which every call needs as well.
/// </summary>
public sealed class ClientCertificateTrust(X509Certificate2Collection authorities)
{
    // RFC 5280 §4.2.1.12: id-kp-clientAuth.
    private const string ClientAuthenticationOid = "1.3.6.1.5.5.7.3.2";

    /// <summary>The trust of the configured file, or null when none is configured (Kestrel then uses the machine store).</summary>
    public static ClientCertificateTrust? From(AuthSettings settings, string contentRoot)
    {
        if (string.IsNullOrWhiteSpace(settings.ClientCertificateCaFile))
        {
            return null;
        }

        var path = Path.GetFullPath(settings.ClientCertificateCaFile, contentRoot);
        var field = $"{AuthSettings.Section}:{nameof(AuthSettings.ClientCertificateCaFile)} = {path}";
        if (!File.Exists(path))
        {
            throw new InvalidOperationException($"{field}: no such file");
        }

        var authorities = new X509Certificate2Collection();
        try
        {
            authorities.ImportFromPemFile(path);
            if (authorities.Count == 0)
            {
                authorities.Add(X509CertificateLoader.LoadCertificateFromFile(path));
            }
        }
        catch (CryptographicException e)
        {
            throw new InvalidOperationException($"{field}: not a PEM or DER certificate file ({e.Message})", e);
        }

        return new ClientCertificateTrust(authorities);
    }

    /// <summary>True when <paramref name="certificate"/> chains to a site CA and may authenticate a client.</summary>
    public bool Admits(X509Certificate2 certificate)
    {
        using var chain = new X509Chain();
        chain.ChainPolicy.TrustMode = X509ChainTrustMode.CustomRootTrust;
        chain.ChainPolicy.CustomTrustStore.AddRange(authorities);
        chain.ChainPolicy.RevocationMode = X509RevocationMode.NoCheck;
        chain.ChainPolicy.ApplicationPolicy.Add(new Oid(ClientAuthenticationOid));
        return chain.Build(certificate);
    }
}
