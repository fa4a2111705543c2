namespace GelDispense.Agent.Formats;

/// <summary>
/// One line cut from the byte stream. <see cref="Text"/> holds its printable characters only;
/// <see cref="NonTextBytes"/> counts what was dropped, and a line with any is never trusted.
/// <see cref="Overlong"/> lines were cut at the format's limit.
/// </summary>
public readonly record struct SplitLine(string Text, int NonTextBytes, bool Overlong)
{
    public bool IsClean => NonTextBytes == 0 && !Overlong;
}
