using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Planning;

/// <summary>
/// Which device makes an addition and the error it is expected to deliver there: the balance at the
/// gross load the step reaches, or the pipette's ISO 8655-2 error converted to grams at the reagent's density.
/// </summary>
internal readonly record struct StepDevice(DispensingMethod Method, double ErrorG, bool Usable, string? Problem)
{
    public static StepDevice OnBalance(BalanceProfile balance, double netG, double grossG)
    {
        var usable = BalanceCapability.CanWeigh(balance, netG, grossG, out var reason);
        var error = BalanceCapability.ExpectedErrorG(balance, netG, Math.Min(grossG, balance.CapacityG));
        return new StepDevice(DispensingMethod.Balance, error, usable, usable ? null : reason);
    }

    public static StepDevice ByPipette(PipetteProfile pipette, double volumeMl, double densityGPerMl)
    {
        var volumeUl = volumeMl * 1000;
        if (!PipetteCapability.CanDeliver(pipette, volumeUl, out var reason))
        {
            return new StepDevice(DispensingMethod.Pipette, double.PositiveInfinity, false, reason);
        }

        return new StepDevice(DispensingMethod.Pipette, PipetteCapability.ExpectedErrorUl(pipette, volumeUl) / 1000 * densityGPerMl, true, null);
    }

    /// <summary>
    /// Routes a step: to the pipette when the reagent is marked volumetric, or when the balance cannot weigh
    /// it or holds it less well than the pipette; otherwise to the balance.
    /// </summary>
    public static StepDevice Choose(PlanRequest request, bool volumetric, bool liquid, double netG, double grossG, double volumeMl, double densityGPerMl, double windowG)
    {
        var balance = OnBalance(request.Balance, netG, grossG);
        if (request.Pipette is not { } pipette || !liquid)
        {
            return balance;
        }

        var byPipette = ByPipette(pipette, volumeMl, densityGPerMl);
        if (!byPipette.Usable)
        {
            return balance;
        }

        var balanceFails = !balance.Usable || balance.ErrorG > windowG;
        return volumetric || (balanceFails && byPipette.ErrorG < balance.ErrorG) ? byPipette : balance;
    }
}
