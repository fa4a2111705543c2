using System.Data.Common;
using GelDispense.Chemistry.Errors;
using GelDispense.Service.Storage;
using Google.Protobuf;
using Grpc.Core;
using Grpc.Core.Interceptors;

namespace GelDispense.Service.Errors;

/// <summary>
/// Turns every exception out of a handler into one <see cref="ApiProblem"/>: typed input errors become
/// INVALID_ARGUMENT with field violations, <see cref="ApiException"/> keeps its code, a transient database failure
/// becomes UNAVAILABLE, anything else is logged and reported as INTERNAL without internals. Runs for native gRPC
/// and for transcoded REST calls alike, and first refuses a request with U+0000 in any text field.
/// </summary>
public sealed class ErrorMappingInterceptor(ILogger<ErrorMappingInterceptor> logger, IDatabase database) : Interceptor
{
    public override async Task<TResponse> UnaryServerHandler<TRequest, TResponse>(
        TRequest request, ServerCallContext context, UnaryServerMethod<TRequest, TResponse> continuation)
    {
        try
        {
            RefuseNulCharacters(request);
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
            RefuseNulCharacters(request);
            await continuation(request, responseStream, context);
        }
        catch (Exception e) when (e is not RpcException)
        {
            throw Translate(e, context);
        }
    }

    /// <summary>Text with U+0000 is refused here, for every method and both protocols (see <see cref="NulCharacters"/>).</summary>
    private static void RefuseNulCharacters(object request)
    {
        if (request is IMessage message && NulCharacters.Find(message) is { Count: > 0 } errors)
        {
            throw new InvalidInputException(errors);
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
            DbException failed when database.IsTransient(failed) => Unavailable(failed, context),
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

    private ApiProblem Unavailable(DbException exception, ServerCallContext context)
    {
        logger.LogWarning(exception, "Database unavailable in {Method}", context.Method);
        return ApiProblem.DatabaseUnavailable;
    }
}
