using GelDispense.Service.Api;
using GelDispense.Service.Errors;

namespace GelDispense.Service.Extensions;

/// <summary>Middleware order and the routes the host serves.</summary>
public static class EndpointExtensions
{
    public static WebApplication UseGelDispensePipeline(this WebApplication app)
    {
        app.UseGelDispenseRequestLogging();
        app.UseMiddleware<RestProblemMiddleware>();
        app.UseSwagger();
        app.UseSwaggerUI(options => options.DocumentTitle = "GelDispense API");
        return app;
    }

    public static WebApplication MapGelDispenseEndpoints(this WebApplication app)
    {
        app.MapGrpcService<CompositionApi>();
        app.MapGrpcService<PlanApi>();
        app.MapGrpcService<ReagentApi>();
        app.MapGrpcService<BatchApi>();
        app.MapGrpcService<ProbeApi>();
        app.MapGrpcReflectionService();
        app.MapGrpcHealthChecksService();
        app.MapHealthChecks("/healthz");
        app.MapGet("/", () => Results.Redirect("/swagger")).ExcludeFromDescription();
        return app;
    }
}
