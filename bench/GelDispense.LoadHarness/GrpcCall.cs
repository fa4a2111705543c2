using Grpc.Net.Client;

namespace GelDispense.LoadHarness;

/// <summary>A gRPC client with its own HTTP/2 channel that repeats one unary call.</summary>
public sealed class GrpcCall(Uri address, Func<GrpcChannel, CancellationToken, Task> call) : ILoadClient
{
    private readonly GrpcChannel _channel = GrpcChannel.ForAddress(address);

    public Task PrepareAsync(CancellationToken cancellationToken) => Task.CompletedTask;

    public Task CallAsync(CancellationToken cancellationToken) => call(_channel, cancellationToken);

    public void Dispose() => _channel.Dispose();
}
