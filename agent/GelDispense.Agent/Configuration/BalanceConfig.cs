namespace GelDispense.Agent.Configuration;

/// <summary>How to reach the balance and read it: exactly one of <see cref="Port"/> (a serial device path) or
/// <see cref="Tcp"/> (host:port); a line format by name, built-in or defined in <see cref="Formats"/>.</summary>
public sealed record BalanceConfig
{
    public string? Port { get; init; }

    public string? Tcp { get; init; }

    public string Format { get; init; } = "column";

    public IReadOnlyList<FormatConfig> Formats { get; init; } = [];

    /// <summary>Terminator for commands; the format's own when absent (crlf, lf or cr).</summary>
    public string? LineEnding { get; init; }

    public SerialConfig Serial { get; init; } = new();

    public CommandsConfig Commands { get; init; } = new();

    /// <summary>Readability d of the balance in grams, used for display and the simulator.</summary>
    public double ReadabilityG { get; init; } = 0.0001;

    /// <summary>Seconds without any byte after which a streaming balance counts as unplugged; absent = never.</summary>
    public double? SilenceLimitS { get; init; }
}
