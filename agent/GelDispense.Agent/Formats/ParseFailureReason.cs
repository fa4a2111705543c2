namespace GelDispense.Agent.Formats;

/// <summary>Why a line from the balance could not be turned into a reading.</summary>
public enum ParseFailureReason
{
    /// <summary>The line matched neither the reading pattern nor any marker.</summary>
    NoMatch,

    /// <summary>The value text is not a finite decimal number.</summary>
    BadNumber,

    /// <summary>The unit is not one we can convert to grams exactly.</summary>
    UnknownUnit,

    /// <summary>The line carried bytes that are not printable ASCII (line noise, a baud mismatch).</summary>
    NonText,

    /// <summary>The line was longer than the format allows; it was cut and thrown away.</summary>
    TooLong,

    /// <summary>The pattern took longer than its time limit on this line.</summary>
    PatternTimeout,
}
