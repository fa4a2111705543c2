using GelDispense.Chemistry.Reagents;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Metrology;
using GelDispense.Chemistry.Planning;

namespace GelDispense.Chemistry.Tests.Support;

/// <summary>Recipes and stations shared by the planning tests: our own scenario, not a published recipe.</summary>
internal static class PlanFixtures
{
    public static readonly ReagentCatalog Catalog = TestReagents.Catalog();

    /// <summary>An analytical balance: d = 0.1 mg, s = 0.1 mg, 220 g.</summary>
    public static readonly BalanceProfile Analytical = new(ReadabilityG: 0.0001, CapacityG: 220, RepeatabilityG: 0.0001);

    /// <summary>A precision top-loader: d = 10 mg, s = 10 mg, 2 kg.</summary>
    public static readonly BalanceProfile TopLoader = new(ReadabilityG: 0.01, CapacityG: 2000, RepeatabilityG: 0.01);

    /// <summary>TEOS : ethanol : water : HCl 37 % in the order a technician adds them, R 4 ± 1 %, 0.08 g/mL ± 2 %.</summary>
    public static Recipe SilicaSol(double gelVolumeMl = 100, double acidRatio = 0.01, double rTolerancePct = 1, double densityTolerancePct = 2) => new()
    {
        Name = "station-3 silica monolith",
        Scale = new BatchScale(ScaleBasis.GelVolumeMl, gelVolumeMl),
        Components =
        [
            new("t-teos", new(1, AmountUnit.Ratio)),
            new("t-ethanol", new(1, AmountUnit.Ratio)),
            new("t-water", new(4, AmountUnit.Ratio)),
            new("t-hcl-37", new(acidRatio, AmountUnit.Ratio)),
        ],
        Spec = new FormulationSpec
        {
            HydrolysisRatio = new SpecTarget(4.0, rTolerancePct),
            OxideDensityGPerMl = new SpecTarget(0.08, densityTolerancePct),
        },
    };

    public static DispensingPlan Plan(Recipe recipe, BalanceProfile balance, PipetteProfile? pipette = null, PlanOptions? options = null) =>
        PlanBuilder.Build(recipe, Catalog, new PlanRequest(balance, pipette, AirConditions.Standard, options));
}
