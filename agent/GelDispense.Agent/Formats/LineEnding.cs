namespace GelDispense.Agent.Formats;

/// <summary>
/// The terminator a balance puts after each line and expects after each command. Incoming lines are
/// split on any of CR, LF or CR LF regardless, because balances and adapters are not consistent about it.
/// </summary>
public enum LineEnding
{
    CrLf,
    Lf,
    Cr,
}
