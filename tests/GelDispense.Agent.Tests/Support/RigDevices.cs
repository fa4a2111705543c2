using GelDispense.Agent.Demo;
using GelDispense.Agent.Simulation;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Tests.Support;

/// <summary>The station's devices in a rig: what the service plans with and what the simulator behaves like.</summary>
internal sealed record RigDevices(BalanceProfile Balance, PipetteProfile? Pipette, SimulatorSettings Simulator)
{
    public static RigDevices Demo => new(DemoScenario.Balance, DemoScenario.Pipette, DemoScenario.Simulator);

    /// <summary>
    /// A 2.2 kg top-loader read to 0.01 g with s = 0.02 g: too coarse for the 1 M ammonia window, so the planner sends
    /// that step to the 2 mL pipette and the balance only weighs the delivery.
    /// </summary>
    public static RigDevices TopLoaderWithPipette => new(
        new BalanceProfile { Id = "NA-BAL-9", ReadabilityG = 0.01, RepeatabilityG = 0.02, CapacityG = 2200 },
        DemoScenario.Pipette,
        DemoScenario.Simulator with { ReadabilityG = 0.01, CapacityG = 2200 });
}
