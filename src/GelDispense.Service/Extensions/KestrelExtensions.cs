using Microsoft.AspNetCore.Server.Kestrel.Core;

namespace GelDispense.Service.Extensions;

/// <summary>
/// Kestrel reads its endpoints from <c>Kestrel:Endpoints</c> (appsettings.json: Rest on HTTP/1.1 at 5080,
/// Grpc on HTTP/2 at 5081; override with <c>--Kestrel:Endpoints:Rest:Url=…</c>). Plaintext HTTP/2 cannot
/// share a port with HTTP/1.1, hence two endpoints. Here only the limits of <see cref="RequestLimits"/> are set.
/// </summary>
public static class KestrelExtensions
{
    public static WebApplicationBuilder AddGelDispenseEndpoints(this WebApplicationBuilder builder)
    {
        var limits = RequestLimits.From(builder.Configuration);
        builder.WebHost.ConfigureKestrel(kestrel =>
        {
            kestrel.Limits.MaxRequestBodySize = limits.MaxRequestBodyBytes;
            kestrel.Limits.RequestHeadersTimeout = TimeSpan.FromSeconds(limits.RequestHeadersTimeoutSeconds);
            kestrel.Limits.KeepAliveTimeout = TimeSpan.FromSeconds(limits.KeepAliveTimeoutSeconds);
            kestrel.Limits.MinRequestBodyDataRate = new MinDataRate(
                limits.MinRequestBodyBytesPerSecond, TimeSpan.FromSeconds(limits.MinRequestBodyGraceSeconds));
        });
        return builder;
    }
}
