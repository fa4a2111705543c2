namespace GelDispense.Chemistry.Composition;

/// <summary>One precursor's part of the oxide network (for mixed oxides such as SiO2–TiO2).</summary>
public sealed record OxideShare(
    string ReagentId,
    string OxideFormula,
    double OxideMassG,
    double OxideMassFraction,
    double MetalMolFraction);
