using GelDispense.Chemistry.Errors;
using GelDispense.Service.Errors;
using Microsoft.AspNetCore.Http.Timeouts;

namespace GelDispense.Service.Security;

/// <summary>
/// Runs inside the request-timeout middleware. A REST route served by a gRPC method reports its cancellation as a
/// CANCELLED problem and never lets the exception reach the timeout middleware; when it was the timeout that
/// cancelled it, this turns the answer into 504 DEADLINE_EXCEEDED. A call that finished despite the timeout keeps
/// its answer: its effects are done, and a 504 would invite a repeat.
/// </summary>
public sealed class RestTimeoutProblem(RequestDelegate next, TimeSpan timeout)
{
    public async Task InvokeAsync(HttpContext context)
    {
        await next(context);
        var timedOut = context.Features.Get<IHttpRequestTimeoutFeature>()?.RequestTimeoutToken.IsCancellationRequested == true;
        if (timedOut && !context.Response.HasStarted && context.Items[ApiProblem.ItemKey] is ApiProblem { Code: Grpc.Core.StatusCode.Cancelled })
        {
            context.Items[ApiProblem.ItemKey] = Problem(timeout);
            context.Response.StatusCode = StatusCodes.Status504GatewayTimeout;
        }
    }

    public static ApiProblem Problem(TimeSpan timeout) => new(
        Grpc.Core.StatusCode.DeadlineExceeded, "The request took longer than the service allows.",
        [new InputError("request", $"{timeout.TotalSeconds:0.###} s", "the call was cancelled at the service's time limit (Limits:RestRequestTimeoutSeconds)")]);
}
