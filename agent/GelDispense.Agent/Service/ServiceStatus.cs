namespace GelDispense.Agent.Service;

/// <summary>Whether the station can reach the service, as shown to the technician.</summary>
public enum ServiceStatus
{
    /// <summary>No call has been made yet.</summary>
    Unknown,

    /// <summary>The last call was answered.</summary>
    Online,

    /// <summary>The last call could not reach the service (after retries, or the circuit is open); work goes on from the journal.</summary>
    Offline,
}
