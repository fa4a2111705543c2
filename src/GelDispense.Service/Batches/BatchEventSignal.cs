using System.Collections.Concurrent;

namespace GelDispense.Service.Batches;

/// <summary>
/// Wakes this process's watchers of a batch as soon as it commits an event for it. Events written by other
/// replicas are picked up by the watchers' polling, so this is a latency shortcut, never the only path.
/// </summary>
public sealed class BatchEventSignal(TimeProvider time)
{
    private readonly ConcurrentDictionary<string, TaskCompletionSource> _waiting = new(StringComparer.Ordinal);

    public void Notify(string batchId)
    {
        if (_waiting.TryRemove(batchId, out var waiters))
        {
            waiters.TrySetResult();
        }
    }

    /// <summary>Returns when the batch has news or <paramref name="pollInterval"/> has passed, whichever is first.</summary>
    public async Task WaitAsync(string batchId, TimeSpan pollInterval, CancellationToken cancellationToken)
    {
        var waiters = _waiting.GetOrAdd(batchId, _ => new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously));
        try
        {
            await waiters.Task.WaitAsync(pollInterval, time, cancellationToken);
        }
        catch (TimeoutException)
        {
            // Polling interval reached: the caller reads the log again.
        }
    }
}
