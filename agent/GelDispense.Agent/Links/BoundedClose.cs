namespace GelDispense.Agent.Links;

/// <summary>
/// Runs a close on its own thread and waits at most a bound. SerialPort.Close() after a timed-out write on a
/// hung-up line can block for many seconds; the reconnect must not wait for it. A close that overruns is left
/// to finish on its thread.
/// </summary>
public static class BoundedClose
{
    /// <returns>True when the close finished within the bound.</returns>
    public static bool Run(Action close, TimeSpan bound)
    {
        var closing = Task.Factory.StartNew(close, CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);

        // Observe a late failure so it never surfaces as an unobserved task exception.
        closing.ContinueWith(t => _ = t.Exception, TaskContinuationOptions.OnlyOnFaulted);
        try
        {
            return closing.Wait(bound);
        }
        catch (AggregateException)
        {
            // A close that throws has still finished with the handle.
            return true;
        }
    }
}
