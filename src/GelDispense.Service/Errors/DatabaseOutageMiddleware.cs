using System.Data.Common;
using System.Globalization;
using GelDispense.Service.Storage;

namespace GelDispense.Service.Errors;

/// <summary>
/// A transient database failure before any handler ran (the API key check reads the key store) is answered as
/// UNAVAILABLE on both protocols: gRPC gets a trailers-only status, REST a 503 problem, written by
/// <see cref="RestProblemMiddleware"/>. Left alone it was a bare HTTP 500, which a gRPC client reads as UNKNOWN and a
/// station as the service's refusal of the addition. Failures inside handlers are mapped by
/// <see cref="ErrorMappingInterceptor"/>.
/// </summary>
public sealed class DatabaseOutageMiddleware(RequestDelegate next, IDatabase database, ILogger<DatabaseOutageMiddleware> logger)
{
    public async Task InvokeAsync(HttpContext context)
    {
        try
        {
            await next(context);
        }
        catch (DbException e) when (database.IsTransient(e) && !context.Response.HasStarted)
        {
            logger.LogWarning(e, "Database unavailable before the handler of {Path}", context.Request.Path);
            var problem = ApiProblem.DatabaseUnavailable;
            var response = context.Response;
            response.Clear();
            if (RestProblemMiddleware.IsGrpc(context.Request))
            {
                response.StatusCode = StatusCodes.Status200OK;
                response.ContentType = "application/grpc";
                response.Headers["grpc-status"] = ((int)problem.Code).ToString(CultureInfo.InvariantCulture);
                response.Headers["grpc-message"] = problem.Title;
            }
            else
            {
                context.Items[ApiProblem.ItemKey] = problem;
                response.StatusCode = problem.HttpStatus;
            }
        }
    }
}
