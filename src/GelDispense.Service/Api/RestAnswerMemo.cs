using System.Security.Cryptography;
using GelDispense.Contracts.V1;
using GelDispense.Service.Errors;
using Microsoft.AspNetCore.Grpc.JsonTranscoding;
using Microsoft.Extensions.Caching.Memory;

namespace GelDispense.Service.Api;

/// <summary>
/// Answers a REST call to a pure route — a plan or a composition, each a function of the request body and the
/// reagent catalog alone (see <see cref="PlanMemo"/>) — with the exact bytes the same body was answered with before.
/// A station asks for the same plan with every batch of a recipe, and writing a plan as JSON costs more than the
/// whole round trip of an empty call, so a repeat skips the JSON transcoding as well as the computation. Only
/// successful answers are kept; it runs after authorization, so a caller is refused exactly as without it. Each answer
/// says in a <c>Cache-Status</c> header (RFC 9211) whether it came from here.
/// </summary>
public sealed class RestAnswerMemo : IDisposable
{
    /// <summary>Bytes of answers kept; beyond it the least recently used answers are dropped.</summary>
    public const long CapacityBytes = 16L * 1024 * 1024;

    /// <summary>Larger answers are sent but not kept.</summary>
    public const int MaxAnswerBytes = 256 * 1024;

    /// <summary>The cache name in the <c>Cache-Status</c> header.</summary>
    public const string CacheName = "GelDispense";

    private static readonly HashSet<string> PureMethods =
    [
        PlanService.Descriptor.FindMethodByName(nameof(PlanService.PlanServiceBase.CreatePlan)).FullName,
        CompositionService.Descriptor.FindMethodByName(nameof(CompositionService.CompositionServiceBase.EvaluateComposition)).FullName,
    ];

    private readonly MemoryCache _answers = new(new MemoryCacheOptions { SizeLimit = CapacityBytes });

    private sealed record Answer(byte[] Body, string? ContentType);

    /// <summary>The gRPC method a REST endpoint transcodes to, when that method is pure; otherwise null.</summary>
    public static string? PureMethod(Endpoint? endpoint) =>
        endpoint?.Metadata.GetMetadata<GrpcJsonTranscodingMetadata>()?.MethodDescriptor.FullName is { } method && PureMethods.Contains(method)
            ? method
            : null;

    public async Task InvokeAsync(HttpContext context, RequestDelegate next)
    {
        if (PureMethod(context.GetEndpoint()) is not { } method)
        {
            await next(context);
            return;
        }

        var key = Key(context.Request, method);
        if (_answers.TryGetValue(key, out Answer? answer) && answer is not null)
        {
            var response = context.Response;
            response.StatusCode = StatusCodes.Status200OK;
            response.ContentType = answer.ContentType;
            response.ContentLength = answer.Body.Length;
            response.Headers["Cache-Status"] = CacheName + "; hit";
            await response.Body.WriteAsync(answer.Body, context.RequestAborted);
            return;
        }

        await AnswerAndRememberAsync(context, next, key);
    }

    public void Dispose() => _answers.Dispose();

    private async Task AnswerAndRememberAsync(HttpContext context, RequestDelegate next, string key)
    {
        var response = context.Response;
        var original = response.Body;
        using var captured = new MemoryStream();
        response.Body = captured;
        // The REST edge buffers the answer, so the response starts after this method has decided whether to keep it.
        var stored = false;
        response.OnStarting(() =>
        {
            response.Headers["Cache-Status"] = CacheName + (stored ? "; fwd=miss; stored" : "; fwd=miss");
            return Task.CompletedTask;
        });
        try
        {
            await next(context);
        }
        finally
        {
            response.Body = original;
        }

        if (response.StatusCode == StatusCodes.Status200OK && captured.Length <= MaxAnswerBytes)
        {
            var body = captured.ToArray();
            _answers.Set(key, new Answer(body, response.ContentType), new MemoryCacheEntryOptions { Size = key.Length + body.Length });
            stored = true;
        }

        captured.Position = 0;
        await captured.CopyToAsync(original, context.RequestAborted);
    }

    /// <summary>The method, the query and a SHA-256 of the body: two calls with the same key ask for the same answer.</summary>
    private static string Key(HttpRequest request, string method) =>
        string.Concat(method, request.QueryString.Value, "#", Convert.ToHexString(SHA256.HashData(RestProblemMiddleware.BufferedBody(request).Span)));
}
