namespace GelDispense.Agent.Links;

/// <summary>A status change with its reason in plain words and, while reconnecting, the attempt number.</summary>
public sealed record LinkStatusChange(LinkStatus Status, string Reason, int Attempt, DateTimeOffset At)
{
    public override string ToString() => Attempt > 0 ? $"{Status} (attempt {Attempt}): {Reason}" : $"{Status}: {Reason}";
}
