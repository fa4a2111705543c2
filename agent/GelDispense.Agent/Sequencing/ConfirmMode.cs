namespace GelDispense.Agent.Sequencing;

/// <summary>How an addition is confirmed.</summary>
public enum ConfirmMode
{
    /// <summary>On the first stable reading inside the window, or past it (an over-pour is what went in).</summary>
    Auto,

    /// <summary>Only when the technician presses Enter, and only on a stable reading.</summary>
    Key,
}
