namespace GelDispense.Agent.Stability;

/// <summary>What decided a verdict, so the display and the journal can say why a reading counted as stable.</summary>
public enum StabilityBasis
{
    BalanceFlag,
    Software,

    /// <summary>Overload, underload or error: there is no mass to judge.</summary>
    NoMass,
}
