using Grpc.Core;
using Grpc.Net.Client;

namespace GelDispense.LoadHarness;

/// <summary>A gRPC client with its own HTTP/2 channel that repeats one unary call, sending the API key when there is one.</summary>
public sealed class GrpcCall(Uri address, string? apiKey, Func<GrpcChannel, CallOptions, Task> call) : ILoadClient
{
    private readonly GrpcChannel _channel = GrpcChannel.ForAddress(address);
    private readonly Metadata? _headers = Headers(apiKey);

    public Task PrepareAsync(CancellationToken cancellationToken) => Task.CompletedTask;

    public Task CallAsync(CancellationToken cancellationToken) => call(_channel, new CallOptions(_headers, cancellationToken: cancellationToken));

    public void Dispose() => _channel.Dispose();

    /// <summary>The call headers carrying <paramref name="apiKey"/> as a bearer token, or none without a key.</summary>
    public static Metadata? Headers(string? apiKey) => apiKey is null ? null : new Metadata { { "authorization", $"Bearer {apiKey}" } };
}
