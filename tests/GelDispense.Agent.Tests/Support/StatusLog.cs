using System.Collections.Concurrent;
using GelDispense.Agent.Links;

namespace GelDispense.Agent.Tests.Support;

/// <summary>Records a link's status changes so a test can wait for one without sleeping blindly.</summary>
internal sealed class StatusLog
{
    private readonly ConcurrentQueue<LinkStatusChange> _changes = new();
    private readonly SemaphoreSlim _arrived = new(0);

    public StatusLog(IBalanceLink link) => link.StatusChanged += (_, change) =>
    {
        _changes.Enqueue(change);
        _arrived.Release();
    };

    public IReadOnlyList<LinkStatusChange> Changes => [.. _changes];

    /// <summary>Waits until a change with <paramref name="status"/> appears after the first <paramref name="skip"/> changes.</summary>
    public Task<LinkStatusChange> WaitForAsync(LinkStatus status, int skip = 0, double seconds = 10) =>
        WaitAsync(status, changes => changes.Skip(skip).FirstOrDefault(c => c.Status == status), seconds);

    /// <summary>Waits until <paramref name="status"/> has been reported <paramref name="count"/> times in all.</summary>
    public Task<LinkStatusChange> WaitForCountAsync(LinkStatus status, int count, double seconds = 10) =>
        WaitAsync(status, changes => changes.Where(c => c.Status == status).Skip(count - 1).FirstOrDefault(), seconds);

    private async Task<LinkStatusChange> WaitAsync(LinkStatus status, Func<IReadOnlyList<LinkStatusChange>, LinkStatusChange?> find, double seconds)
    {
        var deadline = DateTime.UtcNow.AddSeconds(seconds);
        while (true)
        {
            var hit = find(Changes);
            if (hit is not null)
            {
                return hit;
            }

            var left = deadline - DateTime.UtcNow;
            if (left <= TimeSpan.Zero)
            {
                throw new TimeoutException($"no {status} within {seconds} s; saw: {string.Join(" | ", Changes)}");
            }

            await _arrived.WaitAsync(left);
        }
    }
}
