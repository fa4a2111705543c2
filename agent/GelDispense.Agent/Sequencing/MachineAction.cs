namespace GelDispense.Agent.Sequencing;

/// <summary>What the edge must do after the machine has seen an input: nothing, send the tare command, or
/// journal and send the confirmed addition.</summary>
public sealed record MachineAction(MachineActionKind Kind, ConfirmDecision? Decision = null, double GrossG = 0)
{
    public static readonly MachineAction None = new(MachineActionKind.None);

    public static readonly MachineAction SendTare = new(MachineActionKind.SendTare);
}
