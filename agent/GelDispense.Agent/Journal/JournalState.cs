namespace GelDispense.Agent.Journal;

/// <summary>Where a journaled addition stands with the service.</summary>
public enum JournalState
{
    /// <summary>Confirmed at the station and stored here; the service has not acknowledged it yet.</summary>
    Pending,

    /// <summary>The service acknowledged it (recorded now, or earlier under the same addition id).</summary>
    Sent,

    /// <summary>The service refused it for good (e.g. the batch was closed); kept, with the reason, so nothing is lost silently.</summary>
    Rejected,
}
