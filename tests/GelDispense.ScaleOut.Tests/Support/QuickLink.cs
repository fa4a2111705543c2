using GelDispense.Agent.Service;

namespace GelDispense.ScaleOut.Tests.Support;

/// <summary>The agent's link settings scaled down for tests: short deadlines, retries and backoffs, a circuit that closes again soon.</summary>
internal static class QuickLink
{
    public static readonly ServiceLinkSettings Settings = new()
    {
        CallDeadline = TimeSpan.FromSeconds(3),
        RetryAttempts = 3,
        RetryFirstDelay = TimeSpan.FromMilliseconds(50),
        RetryMaxDelay = TimeSpan.FromMilliseconds(200),
        ConnectTimeout = TimeSpan.FromSeconds(1),
        InitialReconnectBackoff = TimeSpan.FromMilliseconds(100),
        MaxReconnectBackoff = TimeSpan.FromMilliseconds(500),
        BreakerOpenFor = TimeSpan.FromMilliseconds(500),
    };
}
