using GelDispense.Contracts.V1;
using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Api;

[Collection(ApiCollection.Name)]
public sealed class ProbeApiTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task Ping_answers_an_empty_message_on_REST_and_gRPC(string engine)
    {
        var host = await hosts.ForAsync(engine);

        var rest = await Demo.PostAsync(host.CreateClient(), "/v1/ping", "{}");
        var grpc = await new ProbeService.ProbeServiceClient(host.Channel()).PingAsync(new PingRequest());

        Assert.Empty(rest.AsObject());
        Assert.Equal(new PingResponse(), grpc);
    }
}
