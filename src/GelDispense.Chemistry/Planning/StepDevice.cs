using GelDispense.Chemistry.Metrology;

namespace GelDispense.Chemistry.Planning;

/// <summary>
/// Which device makes an addition and the error it is expected to deliver there: the balance at the
/// gross load the step reaches, or the pipette's ISO 8655-2 error converted to grams at the reagent's density.
/// </summary>
internal readonly record struct StepDevice(DispensingMethod Method, double ErrorG, bool Usable, string? Problem)
{
    /// <summary>
    /// A balance step is usable within the capacity and above the site's own minimum weight. The USP &lt;41&gt;
    /// minimum weight is not a limit here: it certifies 0.10 % weighings, while a step's window is often
    /// wider; the window-against-error test is the capability check that matters (see <see cref="UspNote"/>).
    /// </summary>
    public static StepDevice OnBalance(BalanceProfile balance, double netG, double grossG)
    {
        string? problem = null;
        if (grossG > balance.CapacityG)
        {
            problem = $"the load {F(grossG)} g exceeds the balance capacity {F(balance.CapacityG)} g";
        }
        else if (balance.MinimumWeightG is { } minimum && netG < minimum)
        {
            problem = $"net mass {F(netG)} g is below the balance's minimum weight {F(minimum)} g";
        }

        // Past the capacity the step is unusable anyway; the error at full load still serves as its allocation weight.
        var loadG = Math.Min(grossG, balance.CapacityG);
        var error = BalanceCapability.ExpectedErrorG(balance, Math.Min(netG, loadG), loadG);
        return new StepDevice(DispensingMethod.Balance, error, problem is null, problem);
    }

    /// <summary>A note when a balance step lies below the USP &lt;41&gt; minimum weight, for sites that work to it.</summary>
    public static string? UspNote(BalanceProfile balance, double netG)
    {
        var usp = BalanceCapability.UspMinimumWeightG(balance);
        return netG < usp ? $"below the USP <41> minimum weight of this balance ({F(usp)} g): not a 0.10 % weighing" : null;
    }

    private static string F(double v) => v.ToString("0.#####", System.Globalization.CultureInfo.InvariantCulture);

    /// <summary>
    /// Routes a step: to the pipette when the reagent is marked volumetric, or when the balance cannot weigh
    /// it or holds it less well than the pipette; otherwise to the balance.
    /// </summary>
    public static StepDevice Choose(PlanRequest request, bool volumetric, bool liquid, double netG, double grossG, double volumeMl, double densityGPerMl, double windowG)
    {
        var balance = OnBalance(request.Balance, netG, grossG);
        var volumeUl = volumeMl * 1000;

        // Outside its useful range the pipette is no candidate and the step stays on the balance, so the reason is never worded.
        if (request.Pipette is not { } pipette || !liquid || !PipetteCapability.CanDeliver(pipette, volumeUl))
        {
            return balance;
        }

        var byPipette = new StepDevice(DispensingMethod.Pipette, PipetteCapability.ExpectedErrorUl(pipette, volumeUl) / 1000 * densityGPerMl, true, null);
        var balanceFails = !balance.Usable || balance.ErrorG > windowG;
        return volumetric || (balanceFails && byPipette.ErrorG < balance.ErrorG) ? byPipette : balance;
    }
}
