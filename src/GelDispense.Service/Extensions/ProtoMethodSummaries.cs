using System.Xml.Linq;
using Microsoft.AspNetCore.Grpc.JsonTranscoding;
using Microsoft.OpenApi;
using Swashbuckle.AspNetCore.SwaggerGen;

namespace GelDispense.Service.Extensions;

/// <summary>
/// Gives each transcoded REST operation the comment of its rpc in the .proto file as its summary. The comment reaches
/// the Contracts XML file on the generated service base method; Grpc.Swagger's own filter for this cannot load
/// against Swashbuckle 11, and Swashbuckle's XML reader does not know that a transcoded route is that method.
/// </summary>
public sealed class ProtoMethodSummaries(IReadOnlyDictionary<string, string> summariesByMethodPrefix) : IOperationFilter
{
    /// <summary>Summaries of the generated service base methods in an XML documentation file, keyed by "Namespace.Service.Method".</summary>
    public static IReadOnlyDictionary<string, string> Read(string xmlDocumentationFile)
    {
        var summaries = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var member in XDocument.Load(xmlDocumentationFile).Descendants("member"))
        {
            var name = (string?)member.Attribute("name") ?? "";
            var summary = member.Element("summary")?.Value;
            var open = name.IndexOf('(', StringComparison.Ordinal);
            if (summary is null || !name.StartsWith("M:", StringComparison.Ordinal) || open < 0)
            {
                continue;
            }

            // M:Ns.PlanService.PlanServiceBase.CreatePlan(...) → Ns.PlanService.CreatePlan
            var parts = name[2..open].Split('.');
            if (parts.Length >= 3 && parts[^2] == parts[^3] + "Base")
            {
                summaries[string.Join('.', parts[..^2].Append(parts[^1]))] = string.Join(' ', summary.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries));
            }
        }

        return summaries;
    }

    public void Apply(OpenApiOperation operation, OperationFilterContext context)
    {
        var method = context.ApiDescription.ActionDescriptor.EndpointMetadata.OfType<GrpcJsonTranscodingMetadata>().FirstOrDefault()?.MethodDescriptor;
        if (method is null || operation.Summary is { Length: > 0 })
        {
            return;
        }

        var key = $"{method.File.GetOptions()?.CsharpNamespace}.{method.Service.Name}.{method.Name}";
        if (summariesByMethodPrefix.TryGetValue(key, out var summary))
        {
            operation.Summary = summary;
        }
    }
}
