namespace GelDispense.Agent.Configuration;

/// <summary>A custom line format in the config file; fields as in <see cref="Formats.LineFormat"/>.</summary>
public sealed record FormatConfig
{
    public string Name { get; init; } = "";

    public string Pattern { get; init; } = "";

    public string? StableFlag { get; init; }

    public string? OverloadPattern { get; init; }

    public string? UnderloadPattern { get; init; }

    public string? ErrorPattern { get; init; }

    public string? DefaultUnit { get; init; }

    public string LineEnding { get; init; } = "crlf";

    public int MaxLineLength { get; init; } = 128;
}
