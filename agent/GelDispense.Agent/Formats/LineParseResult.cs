namespace GelDispense.Agent.Formats;

/// <summary>Either a reading or a failure, never both; the codec never throws for a bad line.</summary>
public readonly record struct LineParseResult(BalanceReading? Reading, ParseFailure? Failure)
{
    public bool IsReading => Reading is not null;

    public static LineParseResult Ok(BalanceReading reading) => new(reading, null);

    public static LineParseResult Fail(ParseFailureReason reason, string detail, string raw) =>
        new(null, new ParseFailure(reason, detail, raw));
}
