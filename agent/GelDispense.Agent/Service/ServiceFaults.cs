using System.Net.Sockets;
using Google.Rpc;
using Grpc.Core;
using Polly.CircuitBreaker;

namespace GelDispense.Agent.Service;

/// <summary>
/// Sorts failures of a call. Transient ones (the service is down, slow or shedding load, or the connection broke under
/// the call) are retried and, when retries run out, mean "offline": the addition stays pending in the journal.
/// Anything else is the service's considered answer (bad input, a closed batch) and is never retried.
/// </summary>
public static class ServiceFaults
{
    public static bool IsTransient(RpcException ex) =>
        ex.StatusCode is StatusCode.Unavailable or StatusCode.DeadlineExceeded or StatusCode.ResourceExhausted || IsBrokenConnection(ex);

    /// <summary>
    /// A status the client made up because the connection failed under the call, not one the service sent.
    /// Grpc.Net.Client reports some of these as Internal: a call sent as the service shuts down, on a connection it has
    /// just closed with GOAWAY, fails with "The HTTP/2 server closed the connection". The HTTP or I/O error is then the
    /// status's debug exception, which a status read from the service's trailers never has.
    /// </summary>
    public static bool IsBrokenConnection(RpcException ex) => Causes(ex).Any(cause => cause is HttpRequestException or IOException);

    /// <summary>
    /// The call never reached the service: the connection could not be made (refused, unreachable, no such host, or
    /// it timed out). Only then is a call that is not idempotent safe to repeat. An UNAVAILABLE the service sends
    /// itself (its database failed for a moment) may come after it acted, and a connection broken under a call may
    /// have carried it.
    /// </summary>
    public static bool CouldNotConnect(RpcException ex) =>
        ex.StatusCode == StatusCode.Unavailable && Causes(ex).Any(cause =>
            cause is SocketException { SocketErrorCode: SocketError.ConnectionRefused or SocketError.HostNotFound or SocketError.HostUnreachable
                or SocketError.NetworkUnreachable or SocketError.TimedOut or SocketError.TryAgain }
            || cause is HttpRequestException { HttpRequestError: HttpRequestError.ConnectionError or HttpRequestError.NameResolutionError });

    /// <summary>
    /// The service refuses the caller, not the request: a missing, wrong or revoked key, or a key for another station.
    /// Nothing about the addition is wrong, so it must stay pending until the key is put right.
    /// </summary>
    public static bool IsAccessRefused(RpcException ex) =>
        ex.StatusCode is StatusCode.Unauthenticated or StatusCode.PermissionDenied;

    /// <summary>True when the call never got a considered answer: a transient status after retries, or an open circuit.</summary>
    public static bool IsUnreachable(Exception ex) =>
        ex is BrokenCircuitException || (ex is RpcException rpc && IsTransient(rpc));

    /// <summary>A short reason for the display and the log, with the service's field violations (field, value, reason) when it sent them.</summary>
    public static string Describe(Exception ex) => ex switch
    {
        BrokenCircuitException => "the service failed repeatedly; calls are paused for a moment",
        RpcException rpc when rpc.GetRpcStatus()?.GetDetail<BadRequest>() is { FieldViolations.Count: > 0 } bad =>
            $"{rpc.StatusCode}: {string.Join("; ", bad.FieldViolations.Select(v => $"{v.Field}: {v.Description}"))}",
        RpcException rpc => $"{rpc.StatusCode}: {rpc.Status.Detail}",
        _ => ex.Message,
    };

    /// <summary>The client-side error a status was made from, and its inner errors; none for a status the service sent.</summary>
    private static IEnumerable<Exception> Causes(RpcException ex)
    {
        for (var cause = ex.Status.DebugException; cause is not null; cause = cause.InnerException)
        {
            yield return cause;
        }
    }
}
