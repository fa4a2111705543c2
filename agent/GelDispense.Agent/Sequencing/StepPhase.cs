namespace GelDispense.Agent.Sequencing;

/// <summary>Where the current step stands.</summary>
public enum StepPhase
{
    /// <summary>Waiting for the balance to settle on the step's starting point (after a tare: near zero).</summary>
    Zeroing,

    /// <summary>The technician adds the reagent; the machine watches for a confirmable reading.</summary>
    Adding,

    /// <summary>Confirmed and journaled; waiting for the service (or the offline fallback) to answer.</summary>
    Recording,
}
