using System.Text.Json.Nodes;
using GelDispense.Contracts.V1;
using GelDispense.Service.Tests.Infrastructure;
using Google.Api;
using Google.Protobuf.Reflection;

namespace GelDispense.Service.Tests.Extensions;

[Collection(ApiCollection.Name)]
public sealed class SwaggerExtensionsTests(ApiHosts hosts)
{
    /// <summary>Every google.api.http rule in the contract, as OpenAPI writes the path (snake_case path parameters in lowerCamelCase).</summary>
    private static IEnumerable<(string Method, string Path)> ContractRoutes() =>
        new[]
        {
            CompositionServiceReflection.Descriptor, PlanServiceReflection.Descriptor, ReagentServiceReflection.Descriptor,
            BatchServiceReflection.Descriptor, ProbeServiceReflection.Descriptor,
        }
            .SelectMany(f => f.Services).SelectMany(s => s.Methods)
            .Select(m => m.GetOptions()?.GetExtension(AnnotationsExtensions.Http))
            .OfType<HttpRule>()
            .Select(r => r.PatternCase == HttpRule.PatternOneofCase.Get ? ("get", r.Get) : ("post", r.Post))
            .Select(r => (r.Item1, System.Text.RegularExpressions.Regex.Replace(r.Item2, "_([a-z])", m => m.Groups[1].Value.ToUpperInvariant())));

    [Theory, SqliteEngine]
    public async Task The_OpenAPI_document_lists_every_REST_route_of_the_contract_with_its_comments(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var document = await Demo.GetAsync(client, "/swagger/v1/swagger.json");
        var paths = document["paths"]!.AsObject();

        var routes = ContractRoutes().ToArray();
        Assert.True(routes.Length >= 13, $"only {routes.Length} http rules found in the contract");
        foreach (var (method, path) in routes)
        {
            Assert.True(paths.ContainsKey(path) && paths[path]![method] is not null, $"{method.ToUpperInvariant()} {path} is missing from the OpenAPI document");
        }

        // Operation summaries are the rpc comments of plan_service.proto and batch_service.proto.
        Assert.StartsWith("Builds the dispensing plan", (string?)paths["/v1/plans"]!["post"]!["summary"], StringComparison.Ordinal);
        Assert.All(routes, r => Assert.False(string.IsNullOrWhiteSpace((string?)paths[r.Path]![r.Method]!["summary"]), $"{r.Method} {r.Path} has no summary"));
        var recipe = document["components"]!["schemas"]!["Recipe"]!["properties"]!["temperatureC"]!;
        Assert.Contains("Unset means 20", (string)recipe["description"]!, StringComparison.Ordinal);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Health_answers_on_REST_and_gRPC(string engine)
    {
        var host = await hosts.ForAsync(engine);
        using var response = await host.CreateClient().GetAsync("/healthz");
        var health = new Grpc.Health.V1.Health.HealthClient(host.Channel());

        var grpc = await health.CheckAsync(new Grpc.Health.V1.HealthCheckRequest());

        Assert.Equal("Healthy", await response.Content.ReadAsStringAsync());
        Assert.Equal(Grpc.Health.V1.HealthCheckResponse.Types.ServingStatus.Serving, grpc.Status);
    }
}
