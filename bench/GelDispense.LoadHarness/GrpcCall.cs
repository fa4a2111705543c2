using Google.Protobuf;
using Google.Protobuf.Reflection;
using Grpc.Core;
using Grpc.Net.Client;

namespace GelDispense.LoadHarness;

/// <summary>
/// A gRPC client with its own HTTP/2 channel that repeats one unary call, sending the API key when there is one. It
/// receives every byte of each answer but does not parse it, as <see cref="RestCall"/> does not decode its JSON: the
/// clients share the service's cores, so a client that parsed a 5.7 KB plan would charge its own work to the plan.
/// </summary>
public sealed class GrpcCall : ILoadClient
{
    private readonly GrpcChannel _channel;
    private readonly CallInvoker _invoker;
    private readonly Method<IMessage, object> _method;
    private readonly Func<IMessage> _request;
    private readonly Metadata? _headers;

    /// <summary>A client calling the unary <paramref name="method"/> (from the generated descriptor) with <paramref name="request"/>'s message each time.</summary>
    public GrpcCall(Uri address, string? apiKey, MethodDescriptor method, Func<IMessage> request)
    {
        _channel = GrpcChannel.ForAddress(address);
        _invoker = _channel.CreateCallInvoker();
        _method = new Method<IMessage, object>(MethodType.Unary, method.Service.FullName, method.Name, RequestMarshaller, AnswerUnparsed);
        _request = request;
        _headers = Headers(apiKey);
    }

    public Task PrepareAsync(CancellationToken cancellationToken) => Task.CompletedTask;

    public async Task CallAsync(CancellationToken cancellationToken)
    {
        using var call = _invoker.AsyncUnaryCall(_method, null, new CallOptions(_headers, cancellationToken: cancellationToken), _request());
        await call.ResponseAsync;
    }

    public void Dispose() => _channel.Dispose();

    /// <summary>The call headers carrying <paramref name="apiKey"/> as a bearer token, or none without a key.</summary>
    public static Metadata? Headers(string? apiKey) => apiKey is null ? null : new Metadata { { "authorization", $"Bearer {apiKey}" } };

    private static readonly Marshaller<IMessage> RequestMarshaller = new(
        (message, context) =>
        {
            context.SetPayloadLength(message.CalculateSize());
            message.WriteTo(context.GetBufferWriter());
            context.Complete();
        },
        _ => throw new NotSupportedException("The harness only sends requests."));

    /// <summary>The channel has read the whole message by the time it asks for it; nothing more is done with it.</summary>
    private static readonly object Received = new();

    private static readonly Marshaller<object> AnswerUnparsed = new(
        (_, _) => throw new NotSupportedException("The harness only receives answers."),
        _ => Received);
}
