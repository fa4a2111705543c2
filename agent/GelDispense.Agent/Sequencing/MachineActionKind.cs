namespace GelDispense.Agent.Sequencing;

/// <summary>The kinds of <see cref="MachineAction"/>.</summary>
public enum MachineActionKind
{
    None,
    SendTare,
    Confirm,
}
