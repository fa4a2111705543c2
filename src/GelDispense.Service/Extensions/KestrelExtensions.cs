using GelDispense.Service.Security;
using Microsoft.AspNetCore.Server.Kestrel.Core;

namespace GelDispense.Service.Extensions;

/// <summary>
/// Kestrel reads its endpoints from <c>Kestrel:Endpoints</c> (appsettings.json: Rest on HTTP/1.1 at 5080,
/// Grpc on HTTP/2 at 5081; override with <c>--Kestrel:Endpoints:Rest:Url=…</c>). Plaintext HTTP/2 cannot
/// share a port with HTTP/1.1, hence two endpoints. Here the limits of <see cref="RequestLimits"/> are set, and
/// client certificates are judged against the site CA when <c>Auth:ClientCertificateCaFile</c> names one.
/// </summary>
public static class KestrelExtensions
{
    public static WebApplicationBuilder AddGelDispenseEndpoints(this WebApplicationBuilder builder)
    {
        var limits = RequestLimits.From(builder.Configuration);
        var clientTrust = ClientCertificateTrust.From(AuthSettings.From(builder.Configuration), builder.Environment.ContentRootPath);
        builder.WebHost.ConfigureKestrel(kestrel =>
        {
            if (clientTrust is not null)
            {
                // Applies to every https endpoint; each endpoint's ClientCertificateMode still decides whether to ask.
                kestrel.ConfigureHttpsDefaults(https => https.ClientCertificateValidation = (certificate, _, _) => clientTrust.Admits(certificate));
            }

            kestrel.Limits.MaxRequestBodySize = limits.MaxRequestBodyBytes;
            kestrel.Limits.RequestHeadersTimeout = TimeSpan.FromSeconds(limits.RequestHeadersTimeoutSeconds);
            kestrel.Limits.KeepAliveTimeout = TimeSpan.FromSeconds(limits.KeepAliveTimeoutSeconds);
            kestrel.Limits.MinRequestBodyDataRate = new MinDataRate(
                limits.MinRequestBodyBytesPerSecond, TimeSpan.FromSeconds(limits.MinRequestBodyGraceSeconds));
        });
        return builder;
    }
}
