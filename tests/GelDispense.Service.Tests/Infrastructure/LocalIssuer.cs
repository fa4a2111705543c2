using System.Security.Claims;
using System.Security.Cryptography;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.Configuration;
using Microsoft.IdentityModel.JsonWebTokens;
using Microsoft.IdentityModel.Tokens;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>
/// A site identity provider in miniature, on a real loopback socket: the OpenID Connect discovery document and a
/// JWKS with one RSA key (OpenID Connect Discovery 1.0, RFC 7517), and tokens signed RS256 with that key (RFC 7519).
/// The service fetches the metadata and keys over HTTP as it would from a real issuer.
/// </summary>
public sealed class LocalIssuer : IAsyncDisposable
{
    private readonly WebApplication _app;
    private readonly RsaSecurityKey _key;

    private LocalIssuer(WebApplication app, RsaSecurityKey key, string address)
    {
        _app = app;
        _key = key;
        Address = address;
    }

    public string Address { get; }

    public static async Task<LocalIssuer> StartAsync()
    {
        var key = new RsaSecurityKey(RSA.Create(2048)) { KeyId = "site-key-1" };
        var builder = WebApplication.CreateSlimBuilder();
        // The test folder holds the service's appsettings.json, whose Kestrel endpoints are not this issuer's.
        builder.Configuration.Sources.Clear();
        builder.Configuration.AddInMemoryCollection(new Dictionary<string, string?> { ["urls"] = "http://127.0.0.1:0" });
        var app = builder.Build();
        var jwk = JsonWebKeyConverter.ConvertFromRSASecurityKey(key);
        // The port is known only once the server listens; the routes read it then.
        var address = "";
        app.MapGet("/.well-known/openid-configuration", () => Results.Json(new Dictionary<string, object>
        {
            ["issuer"] = address,
            ["jwks_uri"] = $"{address}/jwks",
            ["id_token_signing_alg_values_supported"] = new[] { "RS256" },
        }));
        app.MapGet("/jwks", () => Results.Json(new { keys = new[] { new { kty = jwk.Kty, kid = jwk.Kid, use = "sig", alg = "RS256", n = jwk.N, e = jwk.E } } }));
        await app.StartAsync();
        address = app.Urls.Single().TrimEnd('/');
        return new LocalIssuer(app, key, address);
    }

    /// <summary>A token from this issuer; <paramref name="signWith"/> replaces the issuer's key (a forged token).</summary>
    public string Token(string audience, IEnumerable<Claim> claims, DateTime? expires = null, SecurityKey? signWith = null) =>
        new JsonWebTokenHandler().CreateToken(new SecurityTokenDescriptor
        {
            Issuer = Address,
            Audience = audience,
            Subject = new ClaimsIdentity(claims),
            NotBefore = (expires ?? DateTime.UtcNow.AddMinutes(10)).AddMinutes(-30),
            Expires = expires ?? DateTime.UtcNow.AddMinutes(10),
            SigningCredentials = new SigningCredentials(signWith ?? _key, SecurityAlgorithms.RsaSha256),
        });

    public async ValueTask DisposeAsync()
    {
        await _app.StopAsync();
        await _app.DisposeAsync();
    }
}
