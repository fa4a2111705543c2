namespace GelDispense.Agent.Formats;

/// <summary>A line that did not give a reading: the reason, a sentence for the log, and the raw text.</summary>
public sealed record ParseFailure(ParseFailureReason Reason, string Detail, string Raw)
{
    public override string ToString() => $"{Reason}: {Detail} (line '{Raw}')";
}
