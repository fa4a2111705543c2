using GelDispense.Service.Storage;
using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace GelDispense.Service.Extensions;

/// <summary>
/// Two questions, answered on REST and gRPC alike. Ready (<c>/healthz</c>, gRPC service name "") includes the storage
/// check, so a replica whose database is away leaves the load balancer's rotation. Live (<c>/livez</c>, gRPC service
/// name <see cref="LivenessService"/>) leaves storage out: a database outage must not make an orchestrator restart
/// every replica at once, which would not bring the database back.
/// </summary>
public static class HealthExtensions
{
    public const string LivenessService = "liveness";

    private const string ReadyTag = "ready";

    private const string LiveTag = "live";

    public static IServiceCollection AddGelDispenseHealth(this IServiceCollection services)
    {
        services.AddGrpcHealthChecks(options =>
            {
                options.Services.Map("", check => check.Tags.Contains(ReadyTag));
                options.Services.Map(LivenessService, check => check.Tags.Contains(LiveTag));
            })
            .AddCheck<StorageHealthCheck>("storage", tags: [ReadyTag])
            // Answering at all is the liveness signal; this check only gives the probe something to report.
            .AddCheck("process", () => HealthCheckResult.Healthy("serving requests"), tags: [ReadyTag, LiveTag]);
        return services;
    }

    public static WebApplication MapGelDispenseHealth(this WebApplication app)
    {
        app.MapGrpcHealthChecksService().AllowAnonymous();
        app.MapHealthChecks("/healthz", new() { Predicate = check => check.Tags.Contains(ReadyTag) }).AllowAnonymous();
        app.MapHealthChecks("/livez", new() { Predicate = check => check.Tags.Contains(LiveTag) }).AllowAnonymous();
        return app;
    }
}
