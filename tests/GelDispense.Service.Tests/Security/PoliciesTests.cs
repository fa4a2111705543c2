using GelDispense.Contracts.V1;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.AspNetCore.Server;
using Microsoft.AspNetCore.Authorization;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;

namespace GelDispense.Service.Tests.Security;

[Collection(ApiCollection.Name)]
public sealed class PoliciesTests(ApiHosts hosts)
{
    // Reachable without a key on purpose: probes must work before any key exists.
    private static readonly string[] Anonymous = ["/geldispense.v1.ProbeService/Ping", "/v1/ping", "/healthz", "/livez", "/grpc.health.v1.Health/Check", "/grpc.health.v1.Health/Watch", "/grpc.health.v1.Health/List", "/"];

    [Theory, SqliteEngine]
    public async Task Every_gRPC_method_of_the_contract_and_every_REST_route_names_a_policy(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var endpoints = host.Services.GetRequiredService<EndpointDataSource>().Endpoints.OfType<RouteEndpoint>().ToList();
        var contractMethods = ContractFiles().SelectMany(f => f.Services).SelectMany(s => s.Methods).Select(m => $"/{m.Service.FullName}/{m.Name}").ToList();
        Assert.Contains("/geldispense.v1.ApiKeyService/CreateApiKey", contractMethods);

        var unguarded = new List<string>();
        foreach (var method in contractMethods)
        {
            var endpoint = endpoints.FirstOrDefault(e => "/" + e.RoutePattern.RawText?.TrimStart('/') == method);
            Assert.True(endpoint is not null, $"{method} is not mapped");
            if (!Guarded(endpoint!) && !Anonymous.Contains(method))
            {
                unguarded.Add(method);
            }
        }

        foreach (var endpoint in endpoints.Where(e => e.Metadata.GetMetadata<GrpcMethodMetadata>() is not null || e.RoutePattern.RawText?.StartsWith("/v1", StringComparison.Ordinal) == true))
        {
            var route = endpoint.RoutePattern.RawText ?? "";
            if (!Guarded(endpoint) && !Anonymous.Contains(route) && !route.StartsWith("/grpc.", StringComparison.Ordinal))
            {
                unguarded.Add(route);
            }
        }

        Assert.Empty(unguarded);
    }

    private static bool Guarded(RouteEndpoint endpoint) =>
        endpoint.Metadata.GetMetadata<IAllowAnonymous>() is null && endpoint.Metadata.GetOrderedMetadata<IAuthorizeData>().Any(a => !string.IsNullOrEmpty(a.Policy));

    private static IEnumerable<Google.Protobuf.Reflection.FileDescriptor> ContractFiles() =>
    [
        BatchServiceReflection.Descriptor, ReagentServiceReflection.Descriptor, PlanServiceReflection.Descriptor,
        CompositionServiceReflection.Descriptor, ProbeServiceReflection.Descriptor, ApiKeyServiceReflection.Descriptor,
    ];
}
