using System.Net.Security;
using Grpc.Core;
using Grpc.Net.Client;

namespace GelDispense.Agent.Service;

/// <summary>
/// Calls go to one service address at a time, in the order given. When a unary call to the address in use fails
/// with a transient status (<see cref="ServiceFaults.IsTransient"/>: down, slow or shedding load), the next
/// address takes over for later calls; the link's Polly retry then lands on it. Additions are safe to repeat on
/// another replica because the service records an addition id once. Streams follow the address in use when they
/// open and are not moved mid-stream. Owns and disposes its channels.
/// </summary>
public sealed class FailoverCallInvoker : CallInvoker, IDisposable
{
    private readonly Uri[] _addresses;
    private readonly GrpcChannel[] _channels;
    private readonly CallInvoker[] _invokers;
    private int _current;

    // tls comes from ServiceTls.Options and applies to every address; null keeps the system trust store.
    public FailoverCallInvoker(IReadOnlyList<Uri> addresses, ServiceLinkSettings settings, SslClientAuthenticationOptions? tls = null)
    {
        if (addresses.Count == 0)
        {
            throw new ArgumentException("addresses: none given; the link needs at least one service address", nameof(addresses));
        }

        _addresses = [.. addresses];
        _channels = [.. addresses.Select(a => ServiceChannel.Create(a, settings, tls))];
        _invokers = [.. _channels.Select(c => c.CreateCallInvoker())];
    }

    /// <summary>The address calls go to now.</summary>
    public Uri Current => _addresses[Volatile.Read(ref _current)];

    public override AsyncUnaryCall<TResponse> AsyncUnaryCall<TRequest, TResponse>(Method<TRequest, TResponse> method, string? host, CallOptions options, TRequest request)
    {
        var index = Volatile.Read(ref _current);
        var call = _invokers[index].AsyncUnaryCall(method, host, options, request);
        return new AsyncUnaryCall<TResponse>(MoveOnWhenTransient(call.ResponseAsync, index), call.ResponseHeadersAsync, call.GetStatus, call.GetTrailers, call.Dispose);
    }

    public override TResponse BlockingUnaryCall<TRequest, TResponse>(Method<TRequest, TResponse> method, string? host, CallOptions options, TRequest request)
    {
        var index = Volatile.Read(ref _current);
        try
        {
            return _invokers[index].BlockingUnaryCall(method, host, options, request);
        }
        catch (RpcException ex) when (ServiceFaults.IsTransient(ex))
        {
            MoveOn(index);
            throw;
        }
    }

    public override AsyncServerStreamingCall<TResponse> AsyncServerStreamingCall<TRequest, TResponse>(Method<TRequest, TResponse> method, string? host, CallOptions options, TRequest request) =>
        _invokers[Volatile.Read(ref _current)].AsyncServerStreamingCall(method, host, options, request);

    public override AsyncClientStreamingCall<TRequest, TResponse> AsyncClientStreamingCall<TRequest, TResponse>(Method<TRequest, TResponse> method, string? host, CallOptions options) =>
        _invokers[Volatile.Read(ref _current)].AsyncClientStreamingCall(method, host, options);

    public override AsyncDuplexStreamingCall<TRequest, TResponse> AsyncDuplexStreamingCall<TRequest, TResponse>(Method<TRequest, TResponse> method, string? host, CallOptions options) =>
        _invokers[Volatile.Read(ref _current)].AsyncDuplexStreamingCall(method, host, options);

    public void Dispose()
    {
        foreach (var channel in _channels)
        {
            channel.Dispose();
        }
    }

    private async Task<TResponse> MoveOnWhenTransient<TResponse>(Task<TResponse> response, int index)
    {
        try
        {
            return await response.ConfigureAwait(false);
        }
        catch (RpcException ex) when (ServiceFaults.IsTransient(ex))
        {
            MoveOn(index);
            throw;
        }
    }

    // Only the caller that saw the address in use fail moves on, so many calls failing at once advance one step.
    private void MoveOn(int failed) => Interlocked.CompareExchange(ref _current, (failed + 1) % _invokers.Length, failed);
}
