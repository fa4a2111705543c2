using System.Security.Claims;
using System.Text.Encodings.Web;
using Microsoft.AspNetCore.Authentication;
using Microsoft.Extensions.Options;

namespace GelDispense.Service.Security;

/// <summary>
/// Admits a caller that sends "Authorization: Bearer gdk_…" with a key in force. REST and gRPC both carry the
/// header (gRPC as the "authorization" metadata entry). A refused key is logged with the reason, the key id when
/// one was found and the peer address, never with the presented secret.
/// </summary>
public sealed class ApiKeyAuthenticationHandler(
    IOptionsMonitor<AuthenticationSchemeOptions> options, ILoggerFactory logger, UrlEncoder encoder, ApiKeyIssuer issuer)
    : AuthenticationHandler<AuthenticationSchemeOptions>(options, logger, encoder)
{
    public const string SchemeName = "ApiKey";
    private const string BearerPrefix = "Bearer ";

    protected override async Task<AuthenticateResult> HandleAuthenticateAsync()
    {
        var header = Request.Headers.Authorization;
        if (header.Count == 0)
        {
            return AuthenticateResult.NoResult();
        }

        var value = header.Count == 1 ? header[0] ?? "" : "";
        if (!value.StartsWith(BearerPrefix, StringComparison.OrdinalIgnoreCase))
        {
            return Refuse("the Authorization header is not a single Bearer credential");
        }

        var (row, refusal) = await issuer.CheckAsync(value[BearerPrefix.Length..].Trim(), Context.RequestAborted);
        if (row is null)
        {
            return Refuse(refusal);
        }

        var claims = new List<Claim>
        {
            new(GelDispenseClaims.KeyId, row.Id),
            new(GelDispenseClaims.Role, row.Role),
        };
        if (row.StationId.Length > 0)
        {
            claims.Add(new Claim(GelDispenseClaims.StationId, row.StationId));
        }

        var identity = new ClaimsIdentity(claims, SchemeName, GelDispenseClaims.KeyId, GelDispenseClaims.Role);
        return AuthenticateResult.Success(new AuthenticationTicket(new ClaimsPrincipal(identity), SchemeName));
    }

    private AuthenticateResult Refuse(string reason)
    {
        Logger.LogWarning(
            "Authentication refused for {Method} {Path} from {Peer}: {Reason}",
            Request.Method, Request.Path.Value, Context.Connection.RemoteIpAddress?.ToString() ?? "in-process", reason);
        return AuthenticateResult.Fail(reason);
    }
}
