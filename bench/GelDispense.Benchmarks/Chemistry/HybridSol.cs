using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Metrology;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Reagents;
using GelDispense.Chemistry.Replanning;

namespace GelDispense.Benchmarks.Chemistry;

/// <summary>
/// The workload every chemistry benchmark runs: an 8-component TEOS–MTMS hybrid sol of our own (two
/// precursors, ethanol and methanol as the free solvent pair, water, 0.1 M HCl in the acid stage, 1 M ammonia
/// and formamide in the base stage), specified by R and oxide density and scaled to a 250 mL gel, planned on a
/// 620 g precision balance with an air-displacement pipette at hand. The benchmark classes show the minimum and
/// median beside the mean: on a 2-core machine shared with builds, the minimum is the figure other work disturbs least.
/// </summary>
public static class HybridSol
{
    /// <summary>TEOS : MTMS 7 : 3, ethanol : methanol 3 : 1, R 4.0 ± 2 %, 0.060 g/mL SiO2 + CH3SiO1.5 ± 3 %.</summary>
    public static Recipe Recipe { get; } = new()
    {
        Name = "bench-line hybrid monolith H-73",
        TemperatureC = 21.5,
        Scale = new BatchScale(ScaleBasis.GelVolumeMl, 250),
        LinearShrinkage = 0.12,
        Components =
        [
            new("teos", new(0.7, AmountUnit.Ratio), Stage: 1),
            new("mtms", new(0.3, AmountUnit.Ratio), Stage: 1),
            new("ethanol", new(3.0, AmountUnit.Ratio), Stage: 1),
            new("methanol", new(1.0, AmountUnit.Ratio), Stage: 1),
            new("water", new(2.5, AmountUnit.Ratio), Stage: 1),
            new("hcl-0.1m", new(0.0007, AmountUnit.Ratio), Stage: 1),
            new("nh3-1m", new(0.008, AmountUnit.Ratio), Stage: 2),
            new("formamide", new(0.25, AmountUnit.Ratio), Stage: 2),
        ],
        Spec = new FormulationSpec
        {
            HydrolysisRatio = new SpecTarget(4.0, 2),
            OxideDensityGPerMl = new SpecTarget(0.060, 3),
            FreeSolventIds = ["ethanol", "methanol"],
        },
    };

    /// <summary>A precision top-loader: d = 1 mg, s = 1 mg, 620 g.</summary>
    public static BalanceProfile Balance { get; } = new(ReadabilityG: 0.001, CapacityG: 620, RepeatabilityG: 0.001);

    /// <summary>A 100–1000 µL air-displacement pipette for the small catalyst additions.</summary>
    public static PipetteProfile Pipette { get; } = new("P1000-bench-3", NominalVolumeUl: 1000, MinVolumeUl: 100);

    public static PlanRequest Request { get; } =
        new(Balance, Pipette, AirConditions.Standard, new PlanOptions { VesselTareG = 95, VesselCapacityMl = 300 });

    /// <summary>A fresh prepared catalog; preparation is not part of any measured call.</summary>
    public static ReagentCatalog Catalog() => BuiltInReagents.CreateCatalog();

    /// <summary>The first addition (TEOS) over-poured by 3 % and the second (MTMS) on target.</summary>
    public static RecordedAddition[] OverPour(DispensingPlan plan) =>
    [
        new(0, plan.Steps[0].TargetMassG * 1.03),
        new(1, plan.Steps[1].TargetMassG),
    ];
}
