namespace GelDispense.Agent.Formats;

/// <summary>What a balance line reported: a mass, or one of the states in which it shows no usable mass.</summary>
public enum ReadingKind
{
    Weight,
    Overload,
    Underload,
    Error,
}
