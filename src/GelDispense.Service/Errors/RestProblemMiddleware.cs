using System.Text.Json;
using GelDispense.Chemistry.Errors;
using GelDispense.Service.Extensions;

namespace GelDispense.Service.Errors;

/// <summary>
/// The REST edge. Bounds the request body (413 past the limit), and turns every error response of a REST
/// call into RFC 9457 problem details naming field, value and reason: from the <see cref="ApiProblem"/> the
/// interceptor left, or, for errors raised before any handler ran (malformed JSON, a wrong type, an unknown
/// route), from the google.rpc.Status body JSON transcoding wrote. gRPC calls pass through untouched.
/// </summary>
public sealed class RestProblemMiddleware(RequestDelegate next, RequestLimits limits)
{
    public static bool IsGrpc(HttpRequest request) =>
        request.ContentType?.StartsWith("application/grpc", StringComparison.OrdinalIgnoreCase) == true;

    /// <summary>The body of a REST call as this edge buffered it, without a copy; empty when it had none.</summary>
    public static ReadOnlyMemory<byte> BufferedBody(HttpRequest request) =>
        request.Body is MemoryStream buffered && buffered.TryGetBuffer(out var bytes)
            ? new ReadOnlyMemory<byte>(bytes.Array, bytes.Offset, (int)buffered.Length)
            : ReadOnlyMemory<byte>.Empty;

    public async Task InvokeAsync(HttpContext context)
    {
        if (IsGrpc(context.Request) || !context.Request.Path.StartsWithSegments("/v1"))
        {
            await next(context);
            return;
        }

        if (!await BufferRequestBodyAsync(context))
        {
            return;
        }

        var original = context.Response.Body;
        using var buffer = new MemoryStream();
        context.Response.Body = buffer;
        try
        {
            await next(context);
        }
        finally
        {
            context.Response.Body = original;
        }

        // A rate-limited call (429) keeps the limiter's own answer: no problem code maps to it.
        if (context.Response.StatusCode < 400 || context.Response.StatusCode == StatusCodes.Status429TooManyRequests)
        {
            buffer.Position = 0;
            await buffer.CopyToAsync(original, context.RequestAborted);
            return;
        }

        var problem = context.Items[ApiProblem.ItemKey] as ApiProblem ?? FromTranscoderError(context, buffer, context.Response.StatusCode);
        await ProblemWriter.WriteAsync(context, problem.HttpStatus, problem);
    }

    /// <summary>Reads the body into memory up to the limit, so an oversized body is refused before anything parses it.</summary>
    private async Task<bool> BufferRequestBodyAsync(HttpContext context)
    {
        var request = context.Request;
        if (request.ContentLength is 0 || HttpMethods.IsGet(request.Method) || HttpMethods.IsDelete(request.Method))
        {
            return true;
        }

        var max = limits.MaxRequestBodyBytes;
        if (request.ContentLength > max)
        {
            await WriteTooLargeAsync(context, request.ContentLength.Value.ToString(System.Globalization.CultureInfo.InvariantCulture), max);
            return false;
        }

        var copy = new MemoryStream();
        var chunk = new byte[16 * 1024];
        int read;
        while ((read = await request.Body.ReadAsync(chunk, context.RequestAborted)) > 0)
        {
            copy.Write(chunk, 0, read);
            if (copy.Length > max)
            {
                await WriteTooLargeAsync(context, $"more than {max}", max);
                return false;
            }
        }

        copy.Position = 0;
        request.Body = copy;
        context.Response.RegisterForDispose(copy);
        return true;
    }

    private static Task WriteTooLargeAsync(HttpContext context, string size, int max) =>
        ProblemWriter.WriteAsync(context, StatusCodes.Status413PayloadTooLarge, new ApiProblem(
            Grpc.Core.StatusCode.ResourceExhausted, "The request body is too large.",
            [new InputError("body", $"{size} bytes", $"a request body may have at most {max} bytes")]));

    private static ApiProblem FromTranscoderError(HttpContext context, MemoryStream body, int httpStatus)
    {
        if (httpStatus == StatusCodes.Status400BadRequest && RequestBodyDiagnosis.Explain(context) is { } unreadable)
        {
            return new ApiProblem(Grpc.Core.StatusCode.InvalidArgument, "The request body could not be read.", [unreadable]);
        }

        var code = httpStatus switch
        {
            StatusCodes.Status404NotFound => Grpc.Core.StatusCode.NotFound,
            // Refused by authentication or authorization before any handler ran.
            StatusCodes.Status401Unauthorized => Grpc.Core.StatusCode.Unauthenticated,
            StatusCodes.Status403Forbidden => Grpc.Core.StatusCode.PermissionDenied,
            StatusCodes.Status405MethodNotAllowed or StatusCodes.Status415UnsupportedMediaType => Grpc.Core.StatusCode.InvalidArgument,
            < 500 => Grpc.Core.StatusCode.InvalidArgument,
            _ => Grpc.Core.StatusCode.Internal,
        };
        var message = ReadStatusMessage(body) ?? (httpStatus == StatusCodes.Status404NotFound
            ? "no such route; the OpenAPI document at /swagger/v1/swagger.json lists every route"
            : $"the request was refused with HTTP {httpStatus}");
        return code switch
        {
            Grpc.Core.StatusCode.NotFound => new ApiProblem(code, "Not found.", [new InputError("body", "", message)]),
            Grpc.Core.StatusCode.Unauthenticated => new ApiProblem(code, "Credentials missing or refused.",
                [new InputError("Authorization", "", "send 'Authorization: Bearer <key>' with an API key in force")]),
            Grpc.Core.StatusCode.PermissionDenied => new ApiProblem(code, "This key's role may not use this route.",
                [new InputError("Authorization", "", "the key's role does not admit this route")]),
            _ => new ApiProblem(code, "The request could not be read.", [new InputError("body", "", message)]),
        };
    }

    private static string? ReadStatusMessage(MemoryStream body)
    {
        if (body.Length == 0)
        {
            return null;
        }

        try
        {
            using var document = JsonDocument.Parse(body.ToArray());
            return document.RootElement.TryGetProperty("message", out var message) ? message.GetString() : null;
        }
        catch (JsonException)
        {
            return null;
        }
    }
}
