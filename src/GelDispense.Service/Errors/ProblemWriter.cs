using System.Text.Json;

namespace GelDispense.Service.Errors;

/// <summary>Writes an <see cref="ApiProblem"/> as application/problem+json (RFC 9457) with an <c>errors</c> list of field, value and reason.</summary>
public static class ProblemWriter
{
    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web);

    public static async Task WriteAsync(HttpContext context, int httpStatus, ApiProblem problem)
    {
        var response = context.Response;
        response.Clear();
        response.StatusCode = httpStatus;
        response.ContentType = "application/problem+json";
        var grpcStatus = ToUpperSnake(problem.Code.ToString());
        var body = new
        {
            type = $"urn:geldispense:problem:{grpcStatus.ToLowerInvariant().Replace('_', '-')}",
            title = problem.Title,
            status = httpStatus,
            detail = problem.Errors.Count == 0 ? problem.Title : string.Join("; ", problem.Errors),
            grpcStatus,
            errors = problem.Errors.Select(e => new { field = e.Field, value = e.Value, reason = e.Reason }),
            traceId = context.TraceIdentifier,
        };
        await JsonSerializer.SerializeAsync(response.Body, body, Json, context.RequestAborted);
    }

    private static string ToUpperSnake(string pascal) =>
        string.Concat(pascal.Select((c, i) => i > 0 && char.IsUpper(c) ? $"_{c}" : char.ToUpperInvariant(c).ToString()));
}
