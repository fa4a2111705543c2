using System.Net;
using System.Net.Http.Headers;
using System.Net.Sockets;
using System.Text.Json.Nodes;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;
using Grpc.Net.Client;

namespace GelDispense.Service.Tests.Security;

/// <summary>
/// The per-caller token bucket on real sockets, set low (1 permit per second, bucket of 3) so a short burst
/// overruns it and the refill comes within a second or two of real time (the limiter keeps its own clock).
/// </summary>
public sealed class RateLimitRejectionTests
{
    private static readonly Dictionary<string, string> LowLimit = new() { ["Auth:PermitsPerSecondPerKey"] = "1", ["Auth:BurstPerKey"] = "3" };

    [Fact]
    public async Task A_key_past_its_bucket_gets_429_with_Retry_After_and_RESOURCE_EXHAUSTED_while_another_key_is_served_and_it_is_served_again_after_the_refill()
    {
        await using var host = await KestrelHost.StartAsync(LowLimit);
        var (first, second) = (await host.IssueKeyAsync(Roles.Lims), await host.IssueKeyAsync(Roles.Lims));
        using var rest = new HttpClient { BaseAddress = new Uri($"http://127.0.0.1:{host.RestPort}") };

        var statuses = new List<HttpStatusCode>();
        HttpResponseMessage? refused = null;
        for (var call = 0; call < 8; call++)
        {
            var response = await SendAsync(rest, first, "/v1/batches");
            statuses.Add(response.StatusCode);
            if (response.StatusCode == HttpStatusCode.TooManyRequests && refused is null)
            {
                refused = response;
            }
        }

        Assert.Equal(HttpStatusCode.OK, statuses[0]);
        Assert.All(statuses, s => Assert.True(s is HttpStatusCode.OK or HttpStatusCode.TooManyRequests, $"got {(int)s}"));
        Assert.NotNull(refused);
        // RFC 9110 §10.2.3: Retry-After as delay-seconds; one permit per second is due within about a second.
        var retryAfter = refused.Headers.RetryAfter?.Delta;
        Assert.True(retryAfter >= TimeSpan.FromSeconds(1) && retryAfter <= TimeSpan.FromSeconds(5), $"Retry-After {retryAfter}");
        var problem = JsonNode.Parse(await refused.Content.ReadAsStringAsync())!;
        Assert.Equal("RESOURCE_EXHAUSTED", (string?)problem["grpcStatus"]);

        var grpcFirst = new BatchService.BatchServiceClient(GrpcChannel.ForAddress($"http://127.0.0.1:{host.GrpcPort}"));
        var grpcCodes = new List<StatusCode>();
        for (var call = 0; call < 4 && !grpcCodes.Contains(StatusCode.ResourceExhausted); call++)
        {
            grpcCodes.Add(await GrpcStatusAsync(grpcFirst, first));
        }

        Assert.Equal(StatusCode.ResourceExhausted, grpcCodes[^1]);
        Assert.All(grpcCodes, c => Assert.True(c is StatusCode.OK or StatusCode.ResourceExhausted, $"got {c}"));

        // Another key at the same moment has a bucket of its own.
        Assert.Equal(HttpStatusCode.OK, (await SendAsync(rest, second, "/v1/batches")).StatusCode);
        Assert.Equal(StatusCode.OK, await GrpcStatusAsync(grpcFirst, second));

        // Generous bound: the bucket gains a permit each second; ten seconds without one would be a stuck limiter.
        var served = false;
        for (var attempt = 0; attempt < 40 && !served; attempt++)
        {
            await Task.Delay(250);
            served = (await SendAsync(rest, first, "/v1/batches")).StatusCode == HttpStatusCode.OK;
        }

        Assert.True(served, "the first key was not served again within 10 s");
    }

    [Fact]
    public async Task Anonymous_calls_are_limited_per_peer_address_so_one_noisy_peer_does_not_starve_another()
    {
        await using var host = await KestrelHost.StartAsync(LowLimit);
        using var noisy = PeerClient(host, IPAddress.Parse("127.0.0.1"));
        using var quiet = PeerClient(host, IPAddress.Parse("127.0.0.2"));

        var statuses = new List<HttpStatusCode>();
        for (var call = 0; call < 8; call++)
        {
            statuses.Add((await noisy.GetAsync("/healthz")).StatusCode);
        }

        Assert.Contains(HttpStatusCode.TooManyRequests, statuses);
        Assert.Equal(HttpStatusCode.OK, (await quiet.GetAsync("/healthz")).StatusCode);
    }

    private static Task<HttpResponseMessage> SendAsync(HttpClient client, string key, string path)
    {
        var request = new HttpRequestMessage(HttpMethod.Get, path);
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", key);
        return client.SendAsync(request);
    }

    private static async Task<StatusCode> GrpcStatusAsync(BatchService.BatchServiceClient client, string key)
    {
        try
        {
            await client.ListBatchesAsync(new ListBatchesRequest(), new Metadata { { "Authorization", "Bearer " + key } });
            return StatusCode.OK;
        }
        catch (RpcException e)
        {
            return e.StatusCode;
        }
    }

    /// <summary>A REST client whose connections leave from <paramref name="source"/> (all of 127.0.0.0/8 is loopback on Linux).</summary>
    private static HttpClient PeerClient(KestrelHost host, IPAddress source) =>
        new(new SocketsHttpHandler
        {
            ConnectCallback = async (context, cancellationToken) =>
            {
                var socket = new Socket(AddressFamily.InterNetwork, SocketType.Stream, ProtocolType.Tcp);
                socket.Bind(new IPEndPoint(source, 0));
                await socket.ConnectAsync(context.DnsEndPoint, cancellationToken);
                return new NetworkStream(socket, ownsSocket: true);
            },
        })
        { BaseAddress = new Uri($"http://127.0.0.1:{host.RestPort}") };
}
