using System.Globalization;

namespace GelDispense.Service.Extensions;

/// <summary>
/// Bounds on what one request may carry and how long it may take, from the <c>Limits</c> configuration section.
/// The defaults are tighter than Kestrel's own (30 s headers, 130 s keep-alive): a station or LIMS on the site
/// network sends its headers in milliseconds, so a client that dawdles longer is broken or hostile.
/// </summary>
public sealed class RequestLimits
{
    public const string Section = "Limits";

    /// <summary>Largest request body (REST JSON or gRPC message), in bytes. A recipe with 64 components is far below it.</summary>
    public int MaxRequestBodyBytes { get; set; } = 256 * 1024;

    /// <summary>Time a client has to send all request headers before Kestrel closes the connection (slow headers).</summary>
    public double RequestHeadersTimeoutSeconds { get; set; } = 10;

    /// <summary>Time an idle keep-alive connection stays open between requests.</summary>
    public double KeepAliveTimeoutSeconds { get; set; } = 120;

    /// <summary>Slowest request body Kestrel accepts after the grace period (slow bodies); Kestrel's own default.</summary>
    public double MinRequestBodyBytesPerSecond { get; set; } = 240;

    /// <summary>
    /// Time a request body may trickle below <see cref="MinRequestBodyBytesPerSecond"/> before it is cut off; above 1 s,
    /// since Kestrel checks the rate on a one-second heartbeat.
    /// </summary>
    public double MinRequestBodyGraceSeconds { get; set; } = 5;

    /// <summary>Longest a REST call may run; past it the call is cancelled and answered 504. 0 turns it off.</summary>
    public double RestRequestTimeoutSeconds { get; set; } = 30;

    /// <summary>
    /// Longest deadline a unary gRPC call gets: a call with no deadline or a later one is held to this; a client's
    /// shorter deadline stands. Server streams (WatchBatch) are not capped. 0 turns it off.
    /// </summary>
    public double GrpcUnaryMaxDeadlineSeconds { get; set; } = 30;

    public static RequestLimits From(IConfiguration configuration)
    {
        var limits = configuration.GetSection(Section).Get<RequestLimits>() ?? new RequestLimits();
        var errors = limits.Problems().ToList();
        return errors.Count == 0
            ? limits
            : throw new InvalidOperationException($"Invalid {Section} configuration: {string.Join("; ", errors)}");
    }

    private IEnumerable<string> Problems()
    {
        if (MaxRequestBodyBytes <= 0)
        {
            yield return Problem(nameof(MaxRequestBodyBytes), MaxRequestBodyBytes, "must be above 0");
        }

        foreach (var (name, value) in new[]
        {
            (nameof(RequestHeadersTimeoutSeconds), RequestHeadersTimeoutSeconds), (nameof(KeepAliveTimeoutSeconds), KeepAliveTimeoutSeconds),
            (nameof(MinRequestBodyBytesPerSecond), MinRequestBodyBytesPerSecond),
        })
        {
            if (!(value > 0) || double.IsInfinity(value))
            {
                yield return Problem(name, value, "must be a finite number above 0");
            }
        }

        if (!(MinRequestBodyGraceSeconds > 1) || double.IsInfinity(MinRequestBodyGraceSeconds))
        {
            yield return Problem(nameof(MinRequestBodyGraceSeconds), MinRequestBodyGraceSeconds, "must be a finite number above 1");
        }

        foreach (var (name, value) in new[]
        {
            (nameof(RestRequestTimeoutSeconds), RestRequestTimeoutSeconds), (nameof(GrpcUnaryMaxDeadlineSeconds), GrpcUnaryMaxDeadlineSeconds),
        })
        {
            if (!(value >= 0) || double.IsInfinity(value))
            {
                yield return Problem(name, value, "must be a finite number of seconds, 0 to turn it off");
            }
        }
    }

    private static string Problem(string name, double value, string reason) =>
        $"{Section}:{name} = {value.ToString(CultureInfo.InvariantCulture)}: {reason}";
}
