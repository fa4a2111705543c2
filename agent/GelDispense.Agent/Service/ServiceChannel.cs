using System.Net.Security;
using Grpc.Net.Client;

namespace GelDispense.Agent.Service;

/// <summary>
/// The gRPC channel to the service. The handler is a plain <see cref="SocketsHttpHandler"/> wrapped in the channel's
/// own invoker, which has no overall timeout: each call carries its own deadline instead, and a long-lived stream
/// (the service's WatchBatch) would not be cut by an HttpClient timeout. No service config, so no gRPC-level retries.
/// </summary>
public static class ServiceChannel
{
    // tls comes from ServiceTls.Options; null keeps the default validation against the system trust store.
    public static GrpcChannel Create(Uri address, ServiceLinkSettings settings, SslClientAuthenticationOptions? tls = null) =>
        GrpcChannel.ForAddress(address, new GrpcChannelOptions
        {
            HttpHandler = new SocketsHttpHandler
            {
                ConnectTimeout = settings.ConnectTimeout,
                PooledConnectionIdleTimeout = Timeout.InfiniteTimeSpan,
                KeepAlivePingDelay = TimeSpan.FromSeconds(30),
                KeepAlivePingTimeout = TimeSpan.FromSeconds(10),
                EnableMultipleHttp2Connections = true,
                SslOptions = tls ?? new SslClientAuthenticationOptions(),
            },
            InitialReconnectBackoff = settings.InitialReconnectBackoff,
            MaxReconnectBackoff = settings.MaxReconnectBackoff,
        });
}
