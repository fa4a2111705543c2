using GelDispense.Service.Api;
using GelDispense.Service.Errors;
using GelDispense.Service.Security;

namespace GelDispense.Service.Extensions;

/// <summary>Middleware order and the routes the host serves.</summary>
public static class EndpointExtensions
{
    public static WebApplication UseGelDispensePipeline(this WebApplication app)
    {
        app.UseGelDispenseRequestLogging();
        app.UseMiddleware<RestProblemMiddleware>();
        app.UseMiddleware<DatabaseOutageMiddleware>();
        app.UseSwagger();
        app.UseSwaggerUI(options => options.DocumentTitle = "GelDispense API");
        app.UseGelDispenseSecurity();
        // After authorization: a remembered answer goes only to a caller admitted to the route. A remembered body was
        // checked for unknown fields when it was first answered.
        var answers = app.Services.GetRequiredService<RestAnswerMemo>();
        app.UseWhen(context => !RestProblemMiddleware.IsGrpc(context.Request), rest => rest
            .Use(answers.InvokeAsync)
            .Use(UnknownJsonFields.InvokeAsync));
        return app;
    }

    public static WebApplication MapGelDispenseEndpoints(this WebApplication app)
    {
        app.MapGrpcService<CompositionApi>();
        app.MapGrpcService<PlanApi>();
        app.MapGrpcService<ReagentApi>();
        app.MapGrpcService<BatchApi>();
        app.MapGrpcService<ProbeApi>();
        app.MapGrpcService<ApiKeyApi>();
        app.MapGrpcReflectionService().RequireAuthorization(Policies.Read);
        app.MapGelDispenseHealth();
        app.MapGet("/", () => Results.Redirect("/swagger")).ExcludeFromDescription().AllowAnonymous();
        return app;
    }
}
