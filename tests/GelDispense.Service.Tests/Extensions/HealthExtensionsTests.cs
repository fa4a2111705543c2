using System.Net;
using GelDispense.Service.Extensions;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Health.V1;
using static Grpc.Health.V1.HealthCheckResponse.Types;

namespace GelDispense.Service.Tests.Extensions;

/// <summary>
/// Readiness and liveness against a real database outage: a PostgreSQL cluster of the test's own is stopped under a
/// running service. Ready must drop (so a load balancer stops sending work); live must hold (so an orchestrator does
/// not restart every replica over a database it cannot fix).
/// </summary>
public sealed class HealthExtensionsTests
{
    [Theory, PostgresEngine]
    public async Task With_the_database_stopped_the_service_is_no_longer_ready_but_still_live_on_REST_and_gRPC(string engine)
    {
        var cluster = await LocalPostgres.StartAsync();
        var stopped = false;
        try
        {
            await using var host = new ServiceHost(engine, cluster.ConnectionString);
            var rest = host.AnonymousClient();
            var grpc = new Health.HealthClient(host.Channel(null));

            Assert.Equal(HttpStatusCode.OK, (await rest.GetAsync("/healthz")).StatusCode);
            Assert.Equal(HttpStatusCode.OK, (await rest.GetAsync("/livez")).StatusCode);
            Assert.Equal(ServingStatus.Serving, (await grpc.CheckAsync(new HealthCheckRequest())).Status);
            Assert.Equal(ServingStatus.Serving, (await grpc.CheckAsync(new HealthCheckRequest { Service = HealthExtensions.LivenessService })).Status);

            await cluster.DisposeAsync();
            stopped = true;

            Assert.Equal(HttpStatusCode.ServiceUnavailable, (await rest.GetAsync("/healthz")).StatusCode);
            Assert.Equal(ServingStatus.NotServing, (await grpc.CheckAsync(new HealthCheckRequest())).Status);
            Assert.Equal(HttpStatusCode.OK, (await rest.GetAsync("/livez")).StatusCode);
            Assert.Equal(ServingStatus.Serving, (await grpc.CheckAsync(new HealthCheckRequest { Service = HealthExtensions.LivenessService })).Status);
        }
        finally
        {
            if (!stopped)
            {
                await cluster.DisposeAsync();
            }
        }
    }
}
