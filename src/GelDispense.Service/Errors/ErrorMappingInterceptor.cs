using GelDispense.Chemistry.Errors;
using Grpc.Core;
using Grpc.Core.Interceptors;

namespace GelDispense.Service.Errors;

/// <summary>
/// Turns every exception out of a handler into one <see cref="ApiProblem"/>: typed input errors become
/// INVALID_ARGUMENT with field violations, <see cref="ApiException"/> keeps its code, anything else is logged
/// and reported as INTERNAL without internals. Runs for native gRPC and for transcoded REST calls alike.
/// </summary>
public sealed class ErrorMappingInterceptor(ILogger<ErrorMappingInterceptor> logger) : Interceptor
{
    public override async Task<TResponse> UnaryServerHandler<TRequest, TResponse>(
        TRequest request, ServerCallContext context, UnaryServerMethod<TRequest, TResponse> continuation)
    {
        try
        {
            return await continuation(request, context);
        }
        catch (Exception e) when (e is not RpcException)
        {
            throw Translate(e, context);
        }
    }

    public override async Task ServerStreamingServerHandler<TRequest, TResponse>(
        TRequest request, IServerStreamWriter<TResponse> responseStream, ServerCallContext context,
        ServerStreamingServerMethod<TRequest, TResponse> continuation)
    {
        try
        {
            await continuation(request, responseStream, context);
        }
        catch (Exception e) when (e is not RpcException)
        {
            throw Translate(e, context);
        }
    }

    private RpcException Translate(Exception exception, ServerCallContext context)
    {
        var problem = exception switch
        {
            InvalidInputException invalid => new ApiProblem(StatusCode.InvalidArgument, "The request has invalid fields.", invalid.Errors),
            ApiException refused => new ApiProblem(refused.Code, refused.Message, refused.Errors),
            OperationCanceledException when context.CancellationToken.IsCancellationRequested =>
                new ApiProblem(StatusCode.Cancelled, "The call was cancelled.", []),
            _ => null,
        };
        if (problem is null)
        {
            logger.LogError(exception, "Unhandled error in {Method}", context.Method);
            problem = new ApiProblem(StatusCode.Internal, "Internal error; the service log has the details.", []);
        }

        context.GetHttpContext().Items[ApiProblem.ItemKey] = problem;
        return problem.ToRpcException();
    }
}
