namespace GelDispense.Service.Extensions;

/// <summary>Bounds on what one request may carry, from the <c>Limits</c> configuration section.</summary>
public sealed class RequestLimits
{
    public const string Section = "Limits";

    /// <summary>Largest request body (REST JSON or gRPC message), in bytes. A recipe with 64 components is far below it.</summary>
    public int MaxRequestBodyBytes { get; set; } = 256 * 1024;
}
