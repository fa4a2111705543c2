namespace GelDispense.Service.Storage;

/// <summary>Result of a version-checked write: written with its event sequence, or lost to a concurrent writer.</summary>
public readonly record struct WriteOutcome(bool Written, long EventSeq)
{
    public static WriteOutcome Conflict => new(false, 0);
}
