using System.Collections.Concurrent;
using System.Text.Json;
using GelDispense.Chemistry.Errors;
using Google.Protobuf.Reflection;
using Microsoft.AspNetCore.Grpc.JsonTranscoding;

namespace GelDispense.Service.Errors;

/// <summary>
/// Refuses a REST body that names a field its message does not have. JSON transcoding would drop such a field without
/// a word, so a misspelt <c>lotId</c> would record an addition without its lot and a misspelt tolerance would plan to
/// the default one; the caller gets a 400 naming the field and the fields that exist instead. Field names are
/// matched as the protobuf JSON mapping reads them: the lowerCamel JSON name or the field's own name.
/// </summary>
public static class UnknownJsonFields
{
    private static readonly ConcurrentDictionary<MessageDescriptor, Dictionary<string, FieldDescriptor>> FieldsByName = new();

    public static Task InvokeAsync(HttpContext context, RequestDelegate next)
    {
        if (context.GetEndpoint()?.Metadata.GetMetadata<GrpcJsonTranscodingMetadata>() is { } transcoding
            && BodyMessage(transcoding) is { } body
            && RestProblemMiddleware.BufferedBody(context.Request) is { Length: > 0 } json
            && Find(json.Span, body.Message, body.Path) is { } unknown)
        {
            // Rendered by the REST edge (RestProblemMiddleware), as a handler's refusal is.
            var problem = new ApiProblem(Grpc.Core.StatusCode.InvalidArgument, "The request has invalid fields.", [unknown]);
            context.Items[ApiProblem.ItemKey] = problem;
            context.Response.StatusCode = problem.HttpStatus;
            return Task.CompletedTask;
        }

        return next(context);
    }

    /// <summary>
    /// The first field in <paramref name="json"/> that <paramref name="message"/> (or a message nested in it) does not
    /// have, as an error at its path; null when every field is known, and for JSON that does not parse or is not valid
    /// UTF-8 (the transcoder reports those itself).
    /// </summary>
    public static InputError? Find(ReadOnlySpan<byte> json, MessageDescriptor message, string path = "")
    {
        try
        {
            var reader = new Utf8JsonReader(json);
            return reader.Read() && reader.TokenType == JsonTokenType.StartObject ? InObject(ref reader, message, path) : null;
        }
        catch (Exception e) when (e is JsonException or InvalidOperationException)
        {
            // Not JSON, or a name that is not valid UTF-8 (GetString throws InvalidOperationException for it).
            return null;
        }
    }

    private static InputError? InObject(ref Utf8JsonReader reader, MessageDescriptor message, string path)
    {
        var fields = FieldsByName.GetOrAdd(message, Index);
        while (reader.Read() && reader.TokenType == JsonTokenType.PropertyName)
        {
            var name = reader.GetString()!;
            var fieldPath = path.Length == 0 ? name : $"{path}.{name}";
            if (!fields.TryGetValue(name, out var field))
            {
                return new InputError(fieldPath, "", $"{message.Name} has no field '{name}'; its fields are " +
                    string.Join(", ", message.Fields.InDeclarationOrder().Select(f => f.JsonName)));
            }

            reader.Read();
            if (InValue(ref reader, field, fieldPath) is { } error)
            {
                return error;
            }
        }

        return null;
    }

    private static InputError? InValue(ref Utf8JsonReader reader, FieldDescriptor field, string path)
    {
        if (field.IsRepeated && reader.TokenType == JsonTokenType.StartArray)
        {
            var index = 0;
            while (reader.Read() && reader.TokenType != JsonTokenType.EndArray)
            {
                if (InSingle(ref reader, field, $"{path}[{index++}]") is { } error)
                {
                    return error;
                }
            }

            return null;
        }

        return InSingle(ref reader, field, path);
    }

    // Well-known types (timestamps, wrappers, Struct) have JSON forms of their own, and map keys are data, not field
    // names (the contract has no maps); neither is walked.
    private static InputError? InSingle(ref Utf8JsonReader reader, FieldDescriptor field, string path)
    {
        if (field.FieldType == FieldType.Message && !field.IsMap && reader.TokenType == JsonTokenType.StartObject
            && field.MessageType.File.Package != "google.protobuf")
        {
            return InObject(ref reader, field.MessageType, path);
        }

        reader.Skip();
        return null;
    }

    private static Dictionary<string, FieldDescriptor> Index(MessageDescriptor message)
    {
        var fields = new Dictionary<string, FieldDescriptor>(StringComparer.Ordinal);
        foreach (var field in message.Fields.InDeclarationOrder())
        {
            fields[field.JsonName] = field;
            fields[field.Name] = field;
        }

        return fields;
    }

    /// <summary>The message the body holds and the path of its fields in the request: the request itself for <c>body: "*"</c>.</summary>
    private static (MessageDescriptor Message, string Path)? BodyMessage(GrpcJsonTranscodingMetadata transcoding)
    {
        var request = transcoding.MethodDescriptor.InputType;
        return transcoding.HttpRule.Body switch
        {
            "" => null,
            "*" => (request, ""),
            var name => request.FindFieldByName(name) is { FieldType: FieldType.Message } field ? (field.MessageType, field.JsonName) : null,
        };
    }
}
