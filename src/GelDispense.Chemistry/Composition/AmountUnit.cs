namespace GelDispense.Chemistry.Composition;

/// <summary>
/// Units a recipe may state an amount in. Moles count the reagent's active substance; masses and volumes
/// the reagent as supplied (volumes at the recipe temperature); <see cref="Ratio"/> is mol of active
/// substance per mol of total precursor.
/// </summary>
public enum AmountUnit
{
    Mol,
    Mmol,
    G,
    Mg,
    Kg,
    ML,
    UL,
    L,
    Ratio,
}
