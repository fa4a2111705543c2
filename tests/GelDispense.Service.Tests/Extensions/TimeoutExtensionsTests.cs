using System.Net;
using System.Net.Http.Headers;
using System.Text.Json.Nodes;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;
using Grpc.Net.Client;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;

namespace GelDispense.Service.Tests.Extensions;

/// <summary>
/// The per-call limits on real sockets: a REST call past Limits:RestRequestTimeoutSeconds is answered 504 with
/// problem details, a unary gRPC call past Limits:GrpcUnaryMaxDeadlineSeconds ends DEADLINE_EXCEEDED, and the
/// WatchBatch stream outlives that cap. Bounds on waiting are generous; nothing here times the service.
/// </summary>
public sealed class TimeoutExtensionsTests
{
    [Fact]
    public async Task A_REST_call_whose_handler_outlasts_the_request_timeout_is_answered_504_with_problem_details_not_500()
    {
        // The service has no route that can be made slow on demand, so the test adds one that waits until cancelled;
        // the timeout policy, the middleware order and the problem rendering are the service's own.
        await using var host = await KestrelHost.StartAsync(
            new Dictionary<string, string> { ["Limits:RestRequestTimeoutSeconds"] = "0.5" },
            app => app.MapGet("/v1/test-stall", async (CancellationToken cancellationToken) =>
            {
                await Task.Delay(Timeout.InfiniteTimeSpan, cancellationToken);
                return Results.Ok();
            }).AllowAnonymous());
        using var rest = new HttpClient { BaseAddress = new Uri($"http://127.0.0.1:{host.RestPort}"), Timeout = TimeSpan.FromSeconds(20) };

        using var response = await rest.GetAsync("/v1/test-stall");

        Assert.Equal(HttpStatusCode.GatewayTimeout, response.StatusCode);
        var problem = JsonNode.Parse(await response.Content.ReadAsStringAsync())!;
        Assert.Equal("DEADLINE_EXCEEDED", (string?)problem["grpcStatus"]);
        Assert.Equal("request", (string?)problem["errors"]![0]!["field"]);
        using var health = await rest.GetAsync("/healthz");
        Assert.Equal(HttpStatusCode.OK, health.StatusCode);
    }

    [Fact]
    public async Task A_unary_gRPC_call_whose_request_stalls_ends_DEADLINE_EXCEEDED_at_the_cap_even_without_a_client_deadline()
    {
        await using var host = await KestrelHost.StartAsync(new Dictionary<string, string> { ["Limits:GrpcUnaryMaxDeadlineSeconds"] = "1" });
        using var http = new HttpClient { Timeout = TimeSpan.FromSeconds(20) };
        // A gRPC request whose message never arrives: headers, then a body that stays open and silent. The body-rate
        // limit (5 s grace) would end it later and differently; the cap must end it first, with a gRPC status.
        var stalled = new TaskCompletionSource();
        using var request = new HttpRequestMessage(HttpMethod.Post, $"http://127.0.0.1:{host.GrpcPort}/geldispense.v1.ProbeService/Ping")
        {
            Version = HttpVersion.Version20,
            VersionPolicy = HttpVersionPolicy.RequestVersionExact,
            Content = new StalledContent(stalled.Task),
        };
        request.Headers.TryAddWithoutValidation("TE", "trailers");

        using var response = await http.SendAsync(request, HttpCompletionOption.ResponseHeadersRead);
        stalled.SetResult();

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        // A call that ends before any message is a trailers-only response, its status in the headers
        // (grpc/grpc doc/PROTOCOL-HTTP2.md, Trailers-Only); 4 is DEADLINE_EXCEEDED (doc/statuscodes.md).
        Assert.Equal("4", response.Headers.TryGetValues("grpc-status", out var status) ? status.Single() : $"none in {response.Headers}");
    }

    [Fact]
    public async Task The_WatchBatch_stream_stays_open_past_the_unary_deadline_cap_and_still_delivers_events()
    {
        await using var host = await KestrelHost.StartAsync(new Dictionary<string, string> { ["Limits:GrpcUnaryMaxDeadlineSeconds"] = "1" });
        var admin = await host.IssueKeyAsync(Roles.Admin);
        using var rest = new HttpClient { BaseAddress = new Uri($"http://127.0.0.1:{host.RestPort}") };
        rest.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", admin);
        var batch = await Demo.StartBatchAsync(rest);
        var batchId = (string)batch["id"]!;
        var client = new BatchService.BatchServiceClient(GrpcChannel.ForAddress($"http://127.0.0.1:{host.GrpcPort}"));
        using var watch = client.WatchBatch(new WatchBatchRequest { BatchId = batchId }, new Metadata { { "Authorization", "Bearer " + admin } });
        Assert.True(await watch.ResponseStream.MoveNext(CancellationToken.None));

        var next = watch.ResponseStream.MoveNext(CancellationToken.None);
        await Task.WhenAny(next, Task.Delay(TimeSpan.FromSeconds(2.5)));
        Assert.False(next.IsCompleted, $"the stream ended before any new event: {next.Exception?.InnerException?.Message ?? "completed"}");

        var step = batch["steps"]![0]!;
        await Demo.PostAsync(rest, $"/v1/batches/{batchId}/additions", Demo.Addition("w-1", (int)step["index"]!, (double)step["targetReadingG"]!));
        Assert.True(await next.WaitAsync(TimeSpan.FromSeconds(10)));
        Assert.Equal(BatchEventType.AdditionRecorded, watch.ResponseStream.Current.Type);
    }

    /// <summary>A request body that sends nothing until released.</summary>
    private sealed class StalledContent : HttpContent
    {
        private readonly Task _release;

        public StalledContent(Task release)
        {
            _release = release;
            Headers.ContentType = new MediaTypeHeaderValue("application/grpc");
        }

        protected override async Task SerializeToStreamAsync(Stream stream, System.Net.TransportContext? context)
        {
            await stream.FlushAsync();
            await _release;
        }

        protected override bool TryComputeLength(out long length)
        {
            length = 0;
            return false;
        }
    }
}
