namespace GelDispense.Agent.Service;

/// <summary>
/// How hard the agent tries to reach the service before it carries on offline. Each call has its own deadline;
/// transient failures are retried with jittered exponential backoff; a circuit breaker stops hammering a service
/// that is down, so confirmations stay quick while it is away. The channel's own reconnect backoff is capped,
/// so a service that comes back is noticed within <see cref="MaxReconnectBackoff"/>.
/// </summary>
public sealed record ServiceLinkSettings
{
    public TimeSpan CallDeadline { get; init; } = TimeSpan.FromSeconds(5);

    public int RetryAttempts { get; init; } = 3;

    public TimeSpan RetryFirstDelay { get; init; } = TimeSpan.FromMilliseconds(200);

    public TimeSpan RetryMaxDelay { get; init; } = TimeSpan.FromSeconds(2);

    /// <summary>Share of failed calls over <see cref="BreakerSampling"/> that opens the circuit.</summary>
    public double BreakerFailureRatio { get; init; } = 0.5;

    public TimeSpan BreakerSampling { get; init; } = TimeSpan.FromSeconds(10);

    public int BreakerMinimumCalls { get; init; } = 4;

    /// <summary>How long an open circuit fails calls at once before letting one through to test the service.</summary>
    public TimeSpan BreakerOpenFor { get; init; } = TimeSpan.FromSeconds(5);

    public TimeSpan InitialReconnectBackoff { get; init; } = TimeSpan.FromMilliseconds(500);

    public TimeSpan MaxReconnectBackoff { get; init; } = TimeSpan.FromSeconds(5);

    public TimeSpan ConnectTimeout { get; init; } = TimeSpan.FromSeconds(3);

    /// <summary>How often pending journal entries are offered to the service while it is away.</summary>
    public TimeSpan ReplayInterval { get; init; } = TimeSpan.FromSeconds(2);
}
