using GelDispense.Chemistry.Composition;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Mapping;

/// <summary>The evaluator's <see cref="SolComposition"/> as the contract's Composition message.</summary>
public static class CompositionMapping
{
    public static Contract.Composition ToContract(SolComposition sol)
    {
        var composition = new Contract.Composition
        {
            TemperatureC = sol.TemperatureC,
            GelVolumeMl = sol.GelVolumeMl,
            TotalMassG = sol.TotalMassG,
            OxideMassG = sol.OxideMassG,
            OxideDensityGPerMl = sol.OxideDensityGPerMl,
            SolidsVolumeFraction = sol.SolidsVolumeFraction,
            Porosity = sol.Porosity,
            HydrolysisRatio = sol.HydrolysisRatio,
            HydrolysisRegime = Regime(sol.Regime),
            WaterPerHydrolysableGroup = sol.WaterPerHydrolysableGroup,
            PrecursorMol = sol.PrecursorMol,
            WaterMol = sol.WaterMol,
            SolventToPrecursorRatio = sol.SolventRatio,
            CatalystToPrecursorRatio = sol.CatalystRatio,
            CatalystMolarityMolPerL = sol.CatalystMolarityMolPerL,
            AlcoholReleasedMol = sol.AlcoholReleasedMol,
            AlcoholReleasedG = sol.AlcoholReleasedG,
        };
        if (sol.DriedDensityGPerMl is { } dried)
        {
            composition.DriedDensityGPerMl = dried;
        }

        composition.Components.AddRange(sol.Components.Select(c => new Contract.ComponentQuantity
        {
            ReagentId = c.ReagentId,
            Stage = c.Stage,
            MassG = c.MassG,
            Moles = c.Moles,
            VolumeMl = c.VolumeMl,
            WaterMol = c.WaterMol,
            MolPerMolPrecursor = c.MolPerMolPrecursor,
        }));
        composition.Oxides.AddRange(sol.Oxides.Select(o => new Contract.OxideShare
        {
            ReagentId = o.ReagentId,
            OxideFormula = o.OxideFormula,
            OxideMassG = o.OxideMassG,
            OxideMassFraction = o.OxideMassFraction,
            MetalMolFraction = o.MetalMolFraction,
        }));
        composition.Stages.AddRange(sol.Stages.Select(s => new Contract.StageSummary
        {
            Stage = s.Stage,
            VolumeMl = s.VolumeMl,
            PrecursorMol = s.PrecursorMol,
            WaterMol = s.WaterMol,
            HydrolysisRatio = s.HydrolysisRatio,
            OxideDensityGPerMl = s.OxideDensityGPerMl,
            CatalystMolarityMolPerL = s.CatalystMolarityMolPerL,
        }));
        composition.Warnings.AddRange(sol.Warnings);
        composition.Cautions.AddRange(sol.Cautions);
        return composition;
    }

    private static Contract.HydrolysisRegime Regime(HydrolysisRegime regime) => regime switch
    {
        HydrolysisRegime.BelowStoichiometric => Contract.HydrolysisRegime.BelowStoichiometric,
        HydrolysisRegime.RelyingOnCondensationWater => Contract.HydrolysisRegime.RelyingOnCondensationWater,
        HydrolysisRegime.FullHydrolysis => Contract.HydrolysisRegime.FullHydrolysis,
        _ => Contract.HydrolysisRegime.Unspecified,
    };
}
