namespace GelDispense.Agent.Service;

/// <summary>A change of <see cref="ServiceStatus"/> with the reason in plain words.</summary>
public sealed record ServiceStatusChange(ServiceStatus Status, string Reason, DateTimeOffset At)
{
    public override string ToString() => $"{Status}: {Reason}";
}
