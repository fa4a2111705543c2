using System.Text.Json;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Configuration;

/// <summary>
/// Reads a station config file. Syntax errors give the line; type errors and unknown fields give the field path
/// and the offending JSON text. Semantic checks happen when the config is resolved (<see cref="BalanceSetup"/>).
/// </summary>
public static class StationConfigLoader
{
    private static readonly JsonSerializerOptions Options = new(JsonSerializerDefaults.Web)
    {
        ReadCommentHandling = JsonCommentHandling.Skip,
        AllowTrailingCommas = true,
        UnmappedMemberHandling = System.Text.Json.Serialization.JsonUnmappedMemberHandling.Disallow,
        RespectNullableAnnotations = true,
        RespectRequiredConstructorParameters = true,
    };

    public static StationConfig Load(string path)
    {
        if (!File.Exists(path))
        {
            throw new InvalidInputException("config", path, "file not found");
        }

        return Parse(File.ReadAllText(path));
    }

    public static StationConfig Parse(string json)
    {
        JsonDocument document;
        try
        {
            document = JsonDocument.Parse(json, new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
        }
        catch (JsonException ex)
        {
            throw new InvalidInputException("config", $"line {ex.LineNumber + 1}, position {ex.BytePositionInLine + 1}", "not valid JSON");
        }

        using (document)
        {
            try
            {
                return document.Deserialize<StationConfig>(Options)
                    ?? throw new InvalidInputException("config", "null", "the file must hold a JSON object");
            }
            catch (JsonException ex)
            {
                var field = ex.Path is { Length: > 2 } p ? p[2..] : "config";
                var reason = ex.Message.Contains("could not be mapped", StringComparison.Ordinal)
                    ? "unknown field"
                    : "wrong type or missing value for this field";
                throw new InvalidInputException(field, RawText(document.RootElement, field), reason);
            }
        }
    }

    /// <summary>The JSON text at a path such as <c>balance.formats[0].name</c>, or "" when it is absent.</summary>
    private static string RawText(JsonElement root, string path)
    {
        var element = root;
        foreach (var part in path.Replace("[", ".[", StringComparison.Ordinal).Split('.', StringSplitOptions.RemoveEmptyEntries))
        {
            if (part.StartsWith('[') && int.TryParse(part.AsSpan(1, part.Length - 2), out var index)
                && element.ValueKind == JsonValueKind.Array && index < element.GetArrayLength())
            {
                element = element[index];
            }
            else if (element.ValueKind == JsonValueKind.Object && element.TryGetProperty(part, out var child))
            {
                element = child;
            }
            else
            {
                return "";
            }
        }

        return element.GetRawText();
    }
}
