namespace GelDispense.Chemistry.Composition;

/// <summary>
/// Where R stands against g, the hydrolysable groups per precursor. The net reaction of a tetra-alkoxide,
/// M(OR)4 + 2 H2O → MO2 + 4 ROH, needs g/2; full hydrolysis, M(OR)4 + 4 H2O → M(OH)4 + 4 ROH, needs g.
/// </summary>
public enum HydrolysisRegime
{
    /// <summary>R &lt; g/2: too little water to convert all alkoxide to oxide.</summary>
    BelowStoichiometric,

    /// <summary>g/2 ≤ R &lt; g: complete conversion relies on water released by condensation.</summary>
    RelyingOnCondensationWater,

    /// <summary>R ≥ g: enough water to hydrolyse every group.</summary>
    FullHydrolysis,
}
