using System.Net;
using System.Net.Sockets;
using GelDispense.Agent.Hosting;
using GelDispense.Agent.Service;
using GelDispense.Agent.Tests.Support;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using Grpc.Core;
using Grpc.Core.Interceptors;
using Grpc.Net.Client;
using Polly.CircuitBreaker;

namespace GelDispense.Agent.Tests.Service;

/// <summary>The Polly pipeline around real gRPC calls: nothing listening, a silent peer, a peer closing the connection under a call, and the real service refusing.</summary>
[Collection(StationCollection.Name)]
public sealed class ServiceLinkTests : TempDirectoryTest
{
    private static readonly ServiceLinkSettings Settings = StationRig.QuickLink with
    {
        RetryAttempts = 2,
        CallDeadline = TimeSpan.FromMilliseconds(400),
        BreakerMinimumCalls = 3,
        BreakerOpenFor = TimeSpan.FromSeconds(30),
    };

    private static readonly RecordAdditionRequest Request = new() { BatchId = "b-1", AdditionId = "a-1", StepIndex = 0, ReadingG = 1, Stable = true };

    private static readonly CreateBatchRequest BatchRequest = new() { StationId = "bench-1" };

    [Fact]
    public async Task An_unreachable_service_is_retried_then_reported_offline_with_the_transient_status()
    {
        using var channel = ServiceChannel.Create(new Uri($"http://127.0.0.1:{FreePort()}"), Settings);
        var counter = new AttemptCounter();
        var link = new ServiceLink(channel.Intercept(counter), "nowhere", Settings, TimeProvider.System);
        var changes = new List<ServiceStatusChange>();
        link.StatusChanged += changes.Add;

        var ex = await Assert.ThrowsAsync<RpcException>(() => link.RecordAdditionAsync(Request, default));

        Assert.Equal(StatusCode.Unavailable, ex.StatusCode);
        Assert.Equal(1 + Settings.RetryAttempts, counter.Attempts);
        Assert.Equal(ServiceStatus.Offline, link.Status);
        Assert.Equal(ServiceStatus.Offline, Assert.Single(changes).Status);
    }

    [Fact]
    public async Task Once_the_circuit_opens_calls_fail_at_once_without_reaching_the_wire()
    {
        using var channel = ServiceChannel.Create(new Uri($"http://127.0.0.1:{FreePort()}"), Settings);
        var counter = new AttemptCounter();
        var link = new ServiceLink(channel.Intercept(counter), "nowhere", Settings, TimeProvider.System);
        await Assert.ThrowsAsync<RpcException>(() => link.RecordAdditionAsync(Request, default));
        var attemptsBefore = counter.Attempts;

        await Assert.ThrowsAsync<BrokenCircuitException>(() => link.RecordAdditionAsync(Request, default));

        Assert.Equal(attemptsBefore, counter.Attempts);
        Assert.True(ServiceFaults.IsUnreachable(new BrokenCircuitException()));
    }

    [Fact]
    public async Task A_peer_that_never_answers_costs_one_deadline_per_attempt_and_ends_in_deadline_exceeded()
    {
        using var silent = new TcpListener(IPAddress.Loopback, 0);
        silent.Start();
        var port = ((IPEndPoint)silent.LocalEndpoint).Port;
        using var channel = ServiceChannel.Create(new Uri($"http://127.0.0.1:{port}"), Settings);
        var counter = new AttemptCounter();
        var link = new ServiceLink(channel.Intercept(counter), "silent", Settings, TimeProvider.System);

        var ex = await Assert.ThrowsAsync<RpcException>(() => link.GetBatchAsync("b-1", default));

        Assert.Equal(StatusCode.DeadlineExceeded, ex.StatusCode);
        Assert.Equal(1 + Settings.RetryAttempts, counter.Attempts);
        Assert.Equal(ServiceStatus.Offline, link.Status);
    }

    [Fact]
    public async Task A_call_whose_connection_the_service_closes_under_it_is_retried_then_reported_offline()
    {
        // A plain channel, as the tests' bench uses: it reports this close as Internal, not Unavailable.
        await using var peer = new ClosingHttp2Peer();
        using var channel = GrpcChannel.ForAddress(peer.Address);
        var counter = new AttemptCounter();
        var link = new ServiceLink(channel.Intercept(counter), "closing", Settings, TimeProvider.System);

        var ex = await Assert.ThrowsAsync<RpcException>(() => link.RecordAdditionAsync(Request, default));

        // gRPC's HTTP/2 protocol maps a stream ended with NO_ERROR to INTERNAL (grpc/grpc doc/PROTOCOL-HTTP2.md, "Errors", recalled).
        Assert.Equal(StatusCode.Internal, ex.StatusCode);
        Assert.True(ServiceFaults.IsBrokenConnection(ex));
        Assert.True(ServiceFaults.IsUnreachable(ex));
        Assert.Equal(1 + Settings.RetryAttempts, counter.Attempts);
        Assert.Equal(1 + Settings.RetryAttempts, peer.CallsTaken);
        Assert.Equal(ServiceStatus.Offline, link.Status);
    }

    [Fact]
    public async Task A_batch_start_that_cannot_connect_is_retried()
    {
        using var channel = ServiceChannel.Create(new Uri($"http://127.0.0.1:{FreePort()}"), Settings);
        var counter = new AttemptCounter();
        var link = new ServiceLink(channel.Intercept(counter), "nowhere", Settings, TimeProvider.System);

        var ex = await Assert.ThrowsAsync<RpcException>(() => link.CreateBatchAsync(BatchRequest, default));

        Assert.True(ServiceFaults.CouldNotConnect(ex));
        Assert.Equal(1 + Settings.RetryAttempts, counter.Attempts);
    }

    [Fact]
    public async Task A_batch_start_whose_connection_closes_under_it_is_not_repeated_since_the_service_may_have_acted()
    {
        await using var peer = new ClosingHttp2Peer();
        using var channel = ServiceChannel.Create(peer.Address, Settings);
        var counter = new AttemptCounter();
        var link = new ServiceLink(channel.Intercept(counter), "closing", Settings, TimeProvider.System);

        var ex = await Assert.ThrowsAsync<RpcException>(() => link.CreateBatchAsync(BatchRequest, default));

        Assert.False(ServiceFaults.CouldNotConnect(ex));
        Assert.True(ServiceFaults.IsUnreachable(ex));
        Assert.Equal(1, counter.Attempts);
        Assert.Equal(1, peer.CallsTaken);
    }

    [Fact]
    public async Task A_batch_start_the_service_answers_unavailable_is_not_repeated_since_it_may_have_acted()
    {
        await using var server = await UnavailableBatchService.StartAsync();
        using var channel = ServiceChannel.Create(server.Address, Settings);
        var link = new ServiceLink(channel.CreateCallInvoker(), "unavailable", Settings, TimeProvider.System);

        var ex = await Assert.ThrowsAsync<RpcException>(() => link.CreateBatchAsync(BatchRequest, default));

        Assert.Equal(StatusCode.Unavailable, ex.StatusCode);
        Assert.True(ServiceFaults.IsUnreachable(ex));
        Assert.False(ServiceFaults.CouldNotConnect(ex));
        Assert.Equal(1, server.StartsReceived);
    }

    [Fact]
    public void An_internal_error_the_service_sends_is_its_answer_and_not_a_broken_connection()
    {
        var sent = new RpcException(new Status(StatusCode.Internal, "the service failed"));
        var unreadable = new RpcException(new Status(StatusCode.Internal, "Failed to deserialize response message.", new InvalidOperationException("bad bytes")));

        Assert.False(ServiceFaults.IsUnreachable(sent));
        Assert.False(ServiceFaults.IsUnreachable(unreadable));
    }

    [Fact]
    public async Task A_refusal_from_the_service_is_not_retried_and_shows_the_service_is_online()
    {
        await using var service = await EmbeddedService.StartAsync(Path.Combine(Dir, "service.db"));
        using var channel = GrpcChannel.ForAddress(service.Address);
        var counter = new AttemptCounter();
        var link = new ServiceLink(channel.Intercept(counter), "test", Settings, TimeProvider.System, await service.IssueKeyAsync(Roles.Station, "bench-1"));

        var ex = await Assert.ThrowsAsync<RpcException>(() => link.GetBatchAsync("no-such-batch", default));

        Assert.Equal(StatusCode.NotFound, ex.StatusCode);
        Assert.Equal(1, counter.Attempts);
        Assert.Equal(ServiceStatus.Online, link.Status);
        Assert.False(ServiceFaults.IsUnreachable(ex));
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    private sealed class AttemptCounter : Interceptor
    {
        private int _attempts;

        public int Attempts => Volatile.Read(ref _attempts);

        public override AsyncUnaryCall<TResponse> AsyncUnaryCall<TRequest, TResponse>(
            TRequest request, ClientInterceptorContext<TRequest, TResponse> context, AsyncUnaryCallContinuation<TRequest, TResponse> continuation)
        {
            Interlocked.Increment(ref _attempts);
            return continuation(request, context);
        }
    }
}
