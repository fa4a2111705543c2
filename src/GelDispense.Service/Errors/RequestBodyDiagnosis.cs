using System.Text.Json;
using GelDispense.Chemistry.Errors;
using Google.Protobuf;
using Microsoft.AspNetCore.Grpc.JsonTranscoding;

namespace GelDispense.Service.Errors;

/// <summary>
/// JSON transcoding reports any unreadable body as "not correctly formatted". To name the field and the reason,
/// the buffered body is read again: first as plain JSON (syntax, with the JSON path), then as the route's
/// protobuf message (wrong types, unknown fields, unknown enum names).
/// </summary>
public static class RequestBodyDiagnosis
{
    public static InputError? Explain(HttpContext context)
    {
        if (RestProblemMiddleware.BufferedBody(context.Request) is not { Length: > 0 } body
            || context.GetEndpoint()?.Metadata.GetMetadata<GrpcJsonTranscodingMetadata>() is not { } transcoding)
        {
            return null;
        }

        var json = System.Text.Encoding.UTF8.GetString(body.Span);
        try
        {
            using var _ = JsonDocument.Parse(json);
        }
        catch (JsonException e)
        {
            return new InputError(e.Path is { Length: > 1 } path ? $"body{path[1..]}" : "body", Excerpt(json, e.BytePositionInLine), $"malformed JSON: {FirstSentence(e.Message)}");
        }

        var descriptor = transcoding.MethodDescriptor.InputType;
        var bodyField = transcoding.HttpRule.Body;
        if (bodyField is not ("" or "*") && descriptor.FindFieldByName(bodyField)?.MessageType is { } fieldType)
        {
            descriptor = fieldType;
        }

        try
        {
            JsonParser.Default.Parse(json, descriptor);
            return null;
        }
        catch (InvalidProtocolBufferException e)
        {
            return new InputError("body", Excerpt(json, null), e.Message);
        }
        catch (InvalidJsonException e)
        {
            return new InputError("body", Excerpt(json, null), e.Message);
        }
    }

    private static string FirstSentence(string message) => message.Split(" Path:", 2)[0];

    private static string Excerpt(string json, long? position)
    {
        var start = (int)Math.Clamp((position ?? 0) - 30, 0, json.Length);
        var length = Math.Min(80, json.Length - start);
        return json.Substring(start, length);
    }
}
