using System.Security.Cryptography;
using System.Threading.RateLimiting;
using GelDispense.Service.Security;
using GelDispense.Service.Storage;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Authentication.JwtBearer;

namespace GelDispense.Service.Extensions;

/// <summary>
/// Authentication (API keys, and JWTs when <c>Auth:Jwt:Authority</c> is set), the role policies, the first admin
/// key, a token-bucket rate limit per key, and the per-call time limits.
/// </summary>
public static class SecurityExtensions
{
    // Not "Bearer": that is the JwtBearer handler's own scheme name, and the two must not collide.
    private const string KeyOrTokenScheme = "KeyOrToken";

    public static IServiceCollection AddGelDispenseSecurity(this IServiceCollection services, IConfiguration configuration)
    {
        var settings = AuthSettings.From(configuration);
        services.AddSingleton(settings);
        services.AddSingleton(RandomNumberGenerator.Create());
        services.AddSingleton(provider => new ApiKeyStore(
            provider.GetRequiredService<IDatabase>(), provider.GetRequiredService<TimeProvider>(), settings.KeyCachePeriod));
        services.AddSingleton<ApiKeyIssuer>();
        services.AddHostedService<BootstrapKeyHostedService>();

        var jwt = !string.IsNullOrWhiteSpace(settings.Jwt.Authority);
        var authentication = services.AddAuthentication(KeyOrTokenScheme)
            .AddPolicyScheme(KeyOrTokenScheme, "API key or JWT", options => options.ForwardDefaultSelector = context =>
                jwt && !LooksLikeApiKey(context.Request.Headers.Authorization.ToString())
                    ? JwtBearerDefaults.AuthenticationScheme
                    : ApiKeyAuthenticationHandler.SchemeName)
            .AddScheme<AuthenticationSchemeOptions, ApiKeyAuthenticationHandler>(ApiKeyAuthenticationHandler.SchemeName, null);
        if (jwt)
        {
            authentication.AddJwtBearer(options =>
            {
                options.Authority = settings.Jwt.Authority;
                options.Audience = settings.Jwt.Audience;
                options.RequireHttpsMetadata = settings.Jwt.RequireHttpsMetadata;
                options.MapInboundClaims = false;
                options.TokenValidationParameters.RoleClaimType = GelDispenseClaims.Role;
                options.TokenValidationParameters.NameClaimType = GelDispenseClaims.Subject;
                options.Events = new JwtBearerEvents { OnAuthenticationFailed = LogRefusedToken };
            });
        }

        services.AddAuthorization(Policies.Add);
        services.AddRateLimiter(options =>
        {
            options.RejectionStatusCode = StatusCodes.Status429TooManyRequests;
            options.OnRejected = RateLimitRejection.WriteAsync;
            options.GlobalLimiter = PartitionedRateLimiter.Create<HttpContext, string>(context => Partition(context, settings));
        });
        services.AddGelDispenseTimeouts(RequestLimits.From(configuration));
        return services;
    }

    public static WebApplication UseGelDispenseSecurity(this WebApplication app)
    {
        // First, so the time limits also bound the key lookups of authentication.
        app.UseGelDispenseTimeouts();
        app.UseAuthentication();
        // After authentication, so the limiter partitions by the key the caller proved, not by a header anyone can send.
        app.UseRateLimiter();
        app.UseAuthorization();
        return app;
    }

    // As for refused keys: the reason and the peer, never the presented token (IdentityModel hides it in messages too).
    private static Task LogRefusedToken(AuthenticationFailedContext context)
    {
        var request = context.Request;
        context.HttpContext.RequestServices.GetRequiredService<ILoggerFactory>().CreateLogger(typeof(SecurityExtensions)).LogWarning(
            "JWT refused for {Method} {Path} from {Peer}: {Reason}",
            request.Method, request.Path.Value, context.HttpContext.Connection.RemoteIpAddress?.ToString() ?? "in-process",
            context.Exception.Message.Split('\n', 2)[0].Trim());
        return Task.CompletedTask;
    }

    private static bool LooksLikeApiKey(string header) =>
        header.StartsWith("Bearer " + ApiKeySecret.Marker, StringComparison.OrdinalIgnoreCase);

    private static RateLimitPartition<string> Partition(HttpContext context, AuthSettings settings)
    {
        if (settings.PermitsPerSecondPerKey <= 0)
        {
            return RateLimitPartition.GetNoLimiter("off");
        }

        var actor = GelDispenseClaims.Actor(context.User);
        var partition = actor.Length > 0 ? actor : "peer:" + (context.Connection.RemoteIpAddress?.ToString() ?? "in-process");
        return RateLimitPartition.GetTokenBucketLimiter(partition, _ => new TokenBucketRateLimiterOptions
        {
            TokenLimit = Math.Max(settings.BurstPerKey, settings.PermitsPerSecondPerKey),
            TokensPerPeriod = settings.PermitsPerSecondPerKey,
            ReplenishmentPeriod = TimeSpan.FromSeconds(1),
            QueueLimit = 0,
            AutoReplenishment = true,
        });
    }
}
