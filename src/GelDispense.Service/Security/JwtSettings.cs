namespace GelDispense.Service.Security;

/// <summary>The <c>Auth:Jwt</c> section: a site identity provider whose tokens carry "role" and, for stations, "station_id".</summary>
public sealed class JwtSettings
{
    /// <summary>The issuer's address; its OpenID Connect metadata supplies the signing keys. Empty: JWTs are not accepted.</summary>
    public string? Authority { get; set; }

    /// <summary>The audience tokens must name.</summary>
    public string? Audience { get; set; }

    /// <summary>Fetch the issuer's metadata over HTTPS only (default); false only for an issuer on loopback in a test bed.</summary>
    public bool RequireHttpsMetadata { get; set; } = true;
}
