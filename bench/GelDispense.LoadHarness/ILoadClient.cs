namespace GelDispense.LoadHarness;

/// <summary>One simulated client: its own connection, and the call it repeats.</summary>
public interface ILoadClient : IDisposable
{
    /// <summary>Untimed work before the next call (for example starting a new batch when the last one is full).</summary>
    Task PrepareAsync(CancellationToken cancellationToken);

    /// <summary>The timed call; throws when the service does not answer with success.</summary>
    Task CallAsync(CancellationToken cancellationToken);
}
