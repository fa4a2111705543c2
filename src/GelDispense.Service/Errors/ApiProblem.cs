using Google.Protobuf.WellKnownTypes;
using Google.Rpc;
using GelDispense.Chemistry.Errors;
using Grpc.Core;

namespace GelDispense.Service.Errors;

/// <summary>
/// One error as both protocols report it: gRPC gets the code with google.rpc.BadRequest field violations in the
/// rich status, REST gets problem details with the same fields (see <see cref="RestProblemMiddleware"/>).
/// </summary>
public sealed record ApiProblem(Grpc.Core.StatusCode Code, string Title, IReadOnlyList<InputError> Errors)
{
    /// <summary>Key under which the interceptor leaves the problem in HttpContext.Items for the REST renderer.</summary>
    public const string ItemKey = "GelDispense.ApiProblem";

    /// <summary>
    /// The database failed for a moment (a dropped connection, a restart, an exhausted pool, a locked file):
    /// UNAVAILABLE, which a station retries and keeps the addition pending for, where INTERNAL would read as a
    /// considered refusal. Nothing was half written: every write is one transaction, and an addition's id makes its
    /// retry count once.
    /// </summary>
    public static readonly ApiProblem DatabaseUnavailable = new(Grpc.Core.StatusCode.Unavailable, "The database is unavailable for the moment; retry the call.", []);

    /// <summary>HTTP status for REST: conflicts are 409 (transcoding alone would answer FAILED_PRECONDITION with 400).</summary>
    public int HttpStatus => Code switch
    {
        Grpc.Core.StatusCode.InvalidArgument or Grpc.Core.StatusCode.OutOfRange => StatusCodes.Status400BadRequest,
        Grpc.Core.StatusCode.NotFound => StatusCodes.Status404NotFound,
        Grpc.Core.StatusCode.AlreadyExists or Grpc.Core.StatusCode.FailedPrecondition or Grpc.Core.StatusCode.Aborted => StatusCodes.Status409Conflict,
        Grpc.Core.StatusCode.ResourceExhausted => StatusCodes.Status413PayloadTooLarge,
        Grpc.Core.StatusCode.Unauthenticated => StatusCodes.Status401Unauthorized,
        Grpc.Core.StatusCode.PermissionDenied => StatusCodes.Status403Forbidden,
        Grpc.Core.StatusCode.Unimplemented => StatusCodes.Status501NotImplemented,
        Grpc.Core.StatusCode.Unavailable => StatusCodes.Status503ServiceUnavailable,
        Grpc.Core.StatusCode.DeadlineExceeded => StatusCodes.Status504GatewayTimeout,
        Grpc.Core.StatusCode.Cancelled => 499,
        _ => StatusCodes.Status500InternalServerError,
    };

    public RpcException ToRpcException()
    {
        var status = new Google.Rpc.Status { Code = (int)Code, Message = Title };
        if (Errors.Count > 0)
        {
            var badRequest = new BadRequest();
            badRequest.FieldViolations.AddRange(Errors.Select(e => new BadRequest.Types.FieldViolation
            {
                Field = e.Field,
                Description = $"{e.Reason} (value: '{e.Value}')",
                Reason = e.Reason,
            }));
            status.Details.Add(Any.Pack(badRequest));
        }

        return status.ToRpcException();
    }
}
