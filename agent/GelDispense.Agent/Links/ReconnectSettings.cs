namespace GelDispense.Agent.Links;

/// <summary>
/// Backoff between attempts to reopen (exponential with jitter, capped), and an optional silence limit: a
/// streaming balance that says nothing for that long is treated as a pulled cable, which on RS-232 gives no
/// error at all. Leave the limit null for balances that only answer requests.
/// </summary>
public sealed record ReconnectSettings
{
    public TimeSpan FirstDelay { get; init; } = TimeSpan.FromMilliseconds(250);

    public TimeSpan MaxDelay { get; init; } = TimeSpan.FromSeconds(5);

    public TimeSpan? SilenceLimit { get; init; }

    /// <summary>Lines kept for a slow consumer; past this the oldest are dropped, as stale readings are worthless.</summary>
    public int LineBufferCapacity { get; init; } = 1024;
}
