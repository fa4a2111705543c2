namespace GelDispense.Agent.Stability;

/// <summary>Which judge of stability to use.</summary>
public enum StabilityMode
{
    /// <summary>The balance's own flag when the line carries one, else software stability.</summary>
    Auto,

    /// <summary>Only the balance's flag; a reading without one is never stable.</summary>
    BalanceFlag,

    /// <summary>Software stability even when the balance sends a flag (a flag known to be too eager).</summary>
    Software,
}
