namespace GelDispense.Agent.Formats;

/// <summary>Text of a <see cref="LineEnding"/> and its spelling in config files and options.</summary>
public static class LineEndingText
{
    public static string Terminator(this LineEnding ending) => ending switch
    {
        LineEnding.Lf => "\n",
        LineEnding.Cr => "\r",
        _ => "\r\n",
    };

    public static bool TryParse(string? text, out LineEnding ending)
    {
        switch (text?.Trim().ToLowerInvariant())
        {
            case "crlf":
                ending = LineEnding.CrLf;
                return true;
            case "lf":
                ending = LineEnding.Lf;
                return true;
            case "cr":
                ending = LineEnding.Cr;
                return true;
            default:
                ending = LineEnding.CrLf;
                return false;
        }
    }
}
