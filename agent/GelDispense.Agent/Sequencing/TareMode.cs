namespace GelDispense.Agent.Sequencing;

/// <summary>How each step finds its zero.</summary>
public enum TareMode
{
    /// <summary>Send the balance's tare command and wait for a stable reading near zero.</summary>
    BalanceTare,

    /// <summary>Keep the pan as it is: the step starts from the gross reading already there (a software tare),
    /// as for cumulative plans or balances with no tare command configured.</summary>
    Running,
}
