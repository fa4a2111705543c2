using Spectre.Console;

namespace GelDispense.Agent.Display;

/// <summary>
/// The live panel when the output is this process's own terminal, plain log lines otherwise: when stdout is
/// redirected (CI, a pipe, a file), when the caller passed its own writer, or when plain output was asked for.
/// </summary>
public static class DisplayChoice
{
    public static bool IsTerminal(TextWriter output) =>
        ReferenceEquals(output, Console.Out) && !Console.IsOutputRedirected && AnsiConsole.Profile.Capabilities.Interactive;

    public static IStationDisplay Create(TextWriter output, bool plain, TimeProvider time) =>
        !plain && IsTerminal(output)
            ? new LiveConsoleDisplay(AnsiConsole.Console, time, TimeSpan.FromMilliseconds(100))
            : new PlainLogDisplay(output, time, TimeSpan.FromSeconds(2));
}
