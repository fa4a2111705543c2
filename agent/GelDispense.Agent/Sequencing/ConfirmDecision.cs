namespace GelDispense.Agent.Sequencing;

/// <summary>
/// The verdict on one reading during a step: confirm it (with the net reading and where it lies), or hold, with
/// the reason in words the technician can act on.
/// </summary>
public sealed record ConfirmDecision(bool Confirm, double? NetReadingG, WindowPosition? Position, string Reason)
{
    public static ConfirmDecision Hold(string reason, double? netReadingG = null, WindowPosition? position = null) =>
        new(false, netReadingG, position, reason);
}
