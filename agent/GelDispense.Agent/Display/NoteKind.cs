namespace GelDispense.Agent.Display;

/// <summary>How loud a note to the technician is.</summary>
public enum NoteKind
{
    Info,
    Good,
    Warning,
    Alert,
}
