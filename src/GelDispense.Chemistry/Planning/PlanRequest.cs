using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Planning;

/// <summary>The station's devices and air, and the plan options.</summary>
public sealed record PlanRequest(BalanceProfile Balance, PipetteProfile? Pipette = null, AirConditions? Air = null, PlanOptions? Options = null)
{
    public AirConditions AirOrStandard => Air ?? AirConditions.Standard;

    public PlanOptions OptionsOrDefault => Options ?? new PlanOptions();
}
