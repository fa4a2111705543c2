using GelDispense.Agent.Formats;
using GelDispense.Agent.Stability;

namespace GelDispense.Agent.Sequencing;

/// <summary>
/// The one gate for confirming an addition. Never on a reading that is unstable, overloaded, underloaded or in
/// error, nor while the balance link is down (a reading buffered before a hang-up is not the pan now). In auto
/// mode a stable reading below the window means "keep adding"; inside it confirms; past it confirms too, since an
/// over-pour is what went in and must be recorded. A pipette step is one delivery of a set volume that the balance
/// weighs: it confirms once a stable reading shows the delivery has arrived (half the target or more), wherever it
/// lies, since waiting for a coarse balance to agree would ask for a second stroke. In key mode the technician
/// decides, on a stable reading.
/// </summary>
public static class ConfirmRule
{
    public static ConfirmDecision Decide(StabilityVerdict? verdict, bool linkConnected, StepWindow window, double baselineG, ConfirmMode mode, bool keyPressed)
    {
        if (!linkConnected)
        {
            return ConfirmDecision.Hold("balance link down: waiting for it to come back");
        }

        if (verdict is null)
        {
            return ConfirmDecision.Hold("no reading yet");
        }

        var reading = verdict.Reading;
        if (reading.Kind != ReadingKind.Weight || reading.ValueG is not { } grossG)
        {
            return ConfirmDecision.Hold(reading.Kind switch
            {
                ReadingKind.Overload => "balance overloaded: take load off",
                ReadingKind.Underload => "balance underloaded: is the pan in place?",
                _ => "balance reports an error",
            });
        }

        var netG = grossG - baselineG;
        var position = window.Position(netG);
        if (!verdict.IsStable)
        {
            return ConfirmDecision.Hold("moving: wait for a stable reading", netG, position);
        }

        if (netG < 0)
        {
            return ConfirmDecision.Hold("net reading below zero: was something taken off the pan?", netG, position);
        }

        if (mode == ConfirmMode.Key)
        {
            return keyPressed
                ? new ConfirmDecision(true, netG, position, "confirmed by key")
                : ConfirmDecision.Hold(position == WindowPosition.Below ? "stable, below the window: keep adding or press Enter" : "stable: press Enter to confirm", netG, position);
        }

        if (window.ByVolume)
        {
            return netG < 0.5 * window.TargetReadingG
                ? ConfirmDecision.Hold("deliver the volume with the pipette", netG, position)
                : new ConfirmDecision(true, netG, position, "pipette delivery weighed");
        }

        return position == WindowPosition.Below
            ? ConfirmDecision.Hold("stable, below the window: keep adding", netG, position)
            : new ConfirmDecision(true, netG, position, position == WindowPosition.Inside ? "stable in window" : "stable past the window: over-pour");
    }
}
