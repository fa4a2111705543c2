namespace GelDispense.Agent.Formats;

/// <summary>
/// A balance line format as data, so a station can describe a balance we have never seen in its config file.
/// <see cref="Pattern"/> is a .NET regular expression with named groups: <c>value</c> (required),
/// <c>sign</c> (optional, "+" or "-" apart from the digits), <c>unit</c> (optional; <see cref="DefaultUnit"/>
/// applies when absent) and <c>flag</c> (optional; the line is stable when the flag text equals
/// <see cref="StableFlag"/>). Marker patterns are tried first and turn a line into an overload,
/// underload or error reading.
/// </summary>
public sealed record LineFormat
{
    public required string Name { get; init; }

    public required string Pattern { get; init; }

    public string? StableFlag { get; init; }

    public string? OverloadPattern { get; init; }

    public string? UnderloadPattern { get; init; }

    public string? ErrorPattern { get; init; }

    public string? DefaultUnit { get; init; }

    public LineEnding LineEnding { get; init; } = LineEnding.CrLf;

    /// <summary>Longest line accepted, in characters; longer lines are cut and counted as garbage.</summary>
    public int MaxLineLength { get; init; } = 128;

    public string Description { get; init; } = "";
}
