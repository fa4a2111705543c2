using GelDispense.Service.Errors;
using GelDispense.Service.Security;
using Microsoft.AspNetCore.Http.Timeouts;

namespace GelDispense.Service.Extensions;

/// <summary>
/// Per-call time limits from <see cref="RequestLimits"/>: REST calls under a default request-timeout policy (504),
/// unary gRPC calls under a longest deadline. Kestrel's connection timeouts are set in <see cref="KestrelExtensions"/>.
/// </summary>
public static class TimeoutExtensions
{
    public static IServiceCollection AddGelDispenseTimeouts(this IServiceCollection services, RequestLimits limits)
    {
        if (limits.RestRequestTimeoutSeconds > 0)
        {
            var timeout = TimeSpan.FromSeconds(limits.RestRequestTimeoutSeconds);
            services.AddRequestTimeouts(options => options.DefaultPolicy = new RequestTimeoutPolicy
            {
                Timeout = timeout,
                TimeoutStatusCode = StatusCodes.Status504GatewayTimeout,
                // For routes outside the gRPC methods, whose cancellation reaches the timeout middleware itself.
                WriteTimeoutResponse = context =>
                {
                    context.Items[ApiProblem.ItemKey] = RestTimeoutProblem.Problem(timeout);
                    return Task.CompletedTask;
                },
            });
        }

        return services;
    }

    public static WebApplication UseGelDispenseTimeouts(this WebApplication app)
    {
        var limits = app.Services.GetRequiredService<RequestLimits>();
        if (limits.RestRequestTimeoutSeconds > 0)
        {
            var timeout = TimeSpan.FromSeconds(limits.RestRequestTimeoutSeconds);
            // gRPC calls carry their own deadline; a REST-style 504 would break their protocol.
            app.UseWhen(context => !RestProblemMiddleware.IsGrpc(context.Request), rest => rest
                .UseRequestTimeouts()
                .UseMiddleware<RestTimeoutProblem>(timeout));
        }

        if (limits.GrpcUnaryMaxDeadlineSeconds > 0)
        {
            app.UseMiddleware<UnaryDeadlineCap>(TimeSpan.FromSeconds(limits.GrpcUnaryMaxDeadlineSeconds));
        }

        return app;
    }
}
