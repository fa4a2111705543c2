namespace GelDispense.Chemistry.Reagents;

/// <summary>What a reagent does in a sol: the role decides which totals its moles enter.</summary>
public enum ReagentRole
{
    Precursor,
    Solvent,
    Water,
    Catalyst,
    Additive,
}
