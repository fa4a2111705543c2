using System.Globalization;
using Grpc.AspNetCore.Server;

namespace GelDispense.Service.Security;

/// <summary>
/// Holds every unary gRPC call to a longest deadline by rewriting its <c>grpc-timeout</c> header before the call
/// starts, so gRPC's own deadline handling ends it with DEADLINE_EXCEEDED even when the handler never looks at its
/// cancellation token. A client's shorter deadline stands. Server streams (WatchBatch) are left alone: they are
/// meant to stay open.
/// </summary>
public sealed class UnaryDeadlineCap(RequestDelegate next, TimeSpan maxDeadline)
{
    private const string TimeoutHeader = "grpc-timeout";

    public Task InvokeAsync(HttpContext context)
    {
        var method = context.GetEndpoint()?.Metadata.GetMetadata<GrpcMethodMetadata>()?.Method;
        if (method?.Type == Grpc.Core.MethodType.Unary && Errors.RestProblemMiddleware.IsGrpc(context.Request))
        {
            var asked = ParseTimeout(context.Request.Headers[TimeoutHeader].ToString());
            if (asked is null || asked > maxDeadline)
            {
                context.Request.Headers[TimeoutHeader] =
                    ((long)Math.Ceiling(maxDeadline.TotalMilliseconds)).ToString(CultureInfo.InvariantCulture) + "m";
            }
        }

        return next(context);
    }

    /// <summary>The gRPC over HTTP/2 timeout: at most 8 digits and a unit (H, M, S, m, u, n); null when absent or malformed.</summary>
    public static TimeSpan? ParseTimeout(string header)
    {
        if (header.Length is < 2 or > 9 || !long.TryParse(header.AsSpan(0, header.Length - 1), NumberStyles.None, CultureInfo.InvariantCulture, out var amount))
        {
            return null;
        }

        return header[^1] switch
        {
            'H' => TimeSpan.FromHours(amount),
            'M' => TimeSpan.FromMinutes(amount),
            'S' => TimeSpan.FromSeconds(amount),
            'm' => TimeSpan.FromMilliseconds(amount),
            'u' => TimeSpan.FromMicroseconds(amount),
            'n' => TimeSpan.FromTicks(amount / 100),
            _ => null,
        };
    }
}
