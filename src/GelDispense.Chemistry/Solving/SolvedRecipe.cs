using GelDispense.Chemistry.Composition;

namespace GelDispense.Chemistry.Solving;

/// <summary>
/// A recipe solved against its spec: every component as a mass (g, as supplied) at the batch scale, the
/// formulation behind it and its composition. <see cref="WaterFactor"/> and <see cref="SolventFactor"/>
/// say how much the solver multiplied the water and the free solvent relative to the recipe as written.
/// </summary>
public sealed record SolvedRecipe(
    Recipe Recipe,
    Formulation Formulation,
    SolComposition Composition,
    double WaterFactor,
    double SolventFactor);
