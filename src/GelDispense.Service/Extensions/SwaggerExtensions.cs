using Microsoft.OpenApi;

namespace GelDispense.Service.Extensions;

/// <summary>
/// OpenAPI for the transcoded REST routes. The proto comments reach the document through the XML file the
/// Contracts project generates next to the service assembly.
/// </summary>
public static class SwaggerExtensions
{
    public static IServiceCollection AddGelDispenseSwagger(this IServiceCollection services)
    {
        services.AddGrpcSwagger();
        services.AddSwaggerGen(options =>
        {
            options.SwaggerDoc("v1", new OpenApiInfo
            {
                Title = "GelDispense API",
                Version = "v1",
                Description = "Sol-gel recipes to gravimetric dispensing plans, batches and as-made records. " +
                    "Every REST route is also a gRPC method of package geldispense.v1.",
            });
            var contractDocs = Path.Combine(AppContext.BaseDirectory, "GelDispense.Contracts.xml");
            if (File.Exists(contractDocs))
            {
                // Grpc.Swagger's IncludeGrpcXmlComments fails to load against Swashbuckle 11 (its filter implements
                // the older IOperationFilter): Swashbuckle's own XML reader documents the messages, ours the operations.
                options.IncludeXmlComments(contractDocs);
                options.OperationFilter<ProtoMethodSummaries>(ProtoMethodSummaries.Read(contractDocs));
            }
        });
        return services;
    }
}
