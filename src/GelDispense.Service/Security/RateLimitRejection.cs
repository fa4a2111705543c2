using System.Globalization;
using System.Threading.RateLimiting;
using GelDispense.Chemistry.Errors;
using GelDispense.Service.Errors;
using Microsoft.AspNetCore.RateLimiting;

namespace GelDispense.Service.Security;

/// <summary>
/// The answer to a call over its key's (or anonymous peer's) rate: REST gets 429 with Retry-After and problem
/// details; gRPC gets RESOURCE_EXHAUSTED. A gRPC client reads a bare HTTP 429 as UNAVAILABLE, which invites
/// an immediate retry, so gRPC calls get a trailers-only response that carries the gRPC status itself.
/// </summary>
public static class RateLimitRejection
{
    public static async ValueTask WriteAsync(OnRejectedContext rejected, CancellationToken cancellationToken)
    {
        var context = rejected.HttpContext;
        // The token bucket says when the next permit is due; round up so a client that waits that long is served.
        var retryAfterS = rejected.Lease.TryGetMetadata(MetadataName.RetryAfter, out var retryAfter)
            ? Math.Max(1, (int)Math.Ceiling(retryAfter.TotalSeconds))
            : 1;
        var retryAfterText = retryAfterS.ToString(CultureInfo.InvariantCulture);
        var reason = $"more calls than this caller's rate limit allows; retry after {retryAfterText} s";
        if (RestProblemMiddleware.IsGrpc(context.Request))
        {
            context.Response.StatusCode = StatusCodes.Status200OK;
            context.Response.ContentType = "application/grpc";
            context.Response.Headers["grpc-status"] = ((int)Grpc.Core.StatusCode.ResourceExhausted).ToString(CultureInfo.InvariantCulture);
            context.Response.Headers["grpc-message"] = reason;
            context.Response.Headers.RetryAfter = retryAfterText;
            return;
        }

        // The problem writer clears the headers; add Retry-After as the response goes out.
        context.Response.OnStarting(() =>
        {
            context.Response.Headers.RetryAfter = retryAfterText;
            return Task.CompletedTask;
        });
        await ProblemWriter.WriteAsync(context, StatusCodes.Status429TooManyRequests, new ApiProblem(
            Grpc.Core.StatusCode.ResourceExhausted, "Too many requests.", [new InputError("Authorization", "", reason)]));
    }
}
