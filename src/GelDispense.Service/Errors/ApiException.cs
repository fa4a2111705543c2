using GelDispense.Chemistry.Errors;
using Grpc.Core;

namespace GelDispense.Service.Errors;

/// <summary>
/// A refusal the service decides on (unknown id, state conflict, replay with other content), with the gRPC
/// code it maps to and the fields concerned. Bad input found by the chemistry library arrives as
/// <see cref="InvalidInputException"/> instead; both end in the same error shape.
/// </summary>
public sealed class ApiException(StatusCode code, string message, IReadOnlyList<InputError> errors) : Exception(message)
{
    public StatusCode Code { get; } = code;

    public IReadOnlyList<InputError> Errors { get; } = errors;

    public static ApiException NotFound(string field, string value, string what) =>
        new(StatusCode.NotFound, $"No {what} '{value}'.", [new InputError(field, value, $"no {what} with this id")]);

    public static ApiException Conflict(string field, string value, string reason) =>
        new(StatusCode.FailedPrecondition, reason, [new InputError(field, value, reason)]);

    public static ApiException Forbidden(string field, string value, string reason) =>
        new(StatusCode.PermissionDenied, reason, [new InputError(field, value, reason)]);

    public static ApiException AlreadyExists(string field, string value, string reason) =>
        new(StatusCode.AlreadyExists, reason, [new InputError(field, value, reason)]);
}
