using Grpc.Net.Client;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>
/// The real service in memory on a given database: REST through <see cref="WebApplicationFactory{T}.CreateClient()"/>,
/// gRPC through a real GrpcChannel over the test server's handler.
/// </summary>
public sealed class ServiceHost(string engine, string connectionString) : WebApplicationFactory<Program>
{
    public string Engine { get; } = engine;

    public string ConnectionString { get; } = connectionString;

    public GrpcChannel Channel() => GrpcChannel.ForAddress(Server.BaseAddress, new GrpcChannelOptions
    {
        HttpHandler = Server.CreateHandler(),
        // The rich error status travels in trailers; keep it readable in assertions.
        ThrowOperationCanceledOnCancellation = true,
    });

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        builder.UseEnvironment("Testing");
        builder.UseSetting("Storage:Provider", Engine);
        builder.UseSetting("ConnectionStrings:GelDispense", ConnectionString);
        builder.UseSetting("Serilog:MinimumLevel:Default", "Warning");
    }
}
