namespace GelDispense.Agent.Configuration;

/// <summary>
/// TLS to the service (the "service" section). Without a CA file the server certificate is validated against the
/// system trust store; there is no switch to turn validation off.
/// </summary>
public sealed record ServiceTlsConfig
{
    /// <summary>A PEM or DER certificate of the CA that issued the service's certificate (a site's own CA).</summary>
    public string? CaCertificateFile { get; init; }

    /// <summary>A PKCS#12 (.pfx) file with this station's client certificate and its private key.</summary>
    public string? ClientCertificateFile { get; init; }

    public string? ClientCertificatePassword { get; init; }
}
