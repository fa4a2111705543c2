using GelDispense.Agent.Display;
using GelDispense.Agent.Formats;
using GelDispense.Agent.Links;
using GelDispense.Agent.Readings;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Stability;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Metrology;

namespace GelDispense.Agent.Calibration;

/// <summary>
/// Guides a gravimetric pipette check at the balance: for each delivery it zeroes, asks for the volume, waits for a
/// stable reading near the expected mass of water (half to one and a half times it), records it in mg, and at the end
/// evaluates the series against ISO 8655 with the chemistry library. Confirmation follows the same rule as a batch:
/// never on an unstable, overloaded or error reading, never while the balance link is down.
/// </summary>
public sealed class PipetteCheckRunner(IBalanceLink link, LineParser parser, StabilitySettings stability, IStationDisplay display, TimeProvider time)
{
    /// <summary>What the display shows now; read by a simulated technician from another thread.</summary>
    public StationView? CurrentView { get; private set; }

    public static void Check(PipetteCheckPlan plan)
    {
        var errors = plan.Pipette.Validate("pipette").ToList();
        if (errors.Count == 0 && !PipetteCapability.CanDeliver(plan.Pipette, plan.SelectedVolumeUl, out var reason))
        {
            errors.Add(new InputError("--volume", plan.SelectedVolumeUl.ToString(System.Globalization.CultureInfo.InvariantCulture), reason));
        }

        if (plan.Count is < 2 or > 100)
        {
            errors.Add(new InputError("--count", plan.Count.ToString(System.Globalization.CultureInfo.InvariantCulture), "use 2 to 100 deliveries (ISO 8655-6 asks for 10)"));
        }

        if (errors.Count > 0)
        {
            throw new InvalidInputException(errors);
        }
    }

    public async Task<PipetteCheckResult> RunAsync(PipetteCheckPlan plan, CancellationToken cancellationToken)
    {
        Check(plan);
        var expectedG = plan.ExpectedReadingG;
        var machine = new StepMachine(new StepMachineSettings { Tare = plan.TareCommand is null ? TareMode.Running : TareMode.BalanceTare, ZeroBandG = 5 * plan.ReadabilityG });
        var massesMg = new List<double>();
        var stream = new BalanceReadingStream(link, parser, new StabilityDetector(stability, time));
        link.Start();
        await ExecuteAsync(machine.Begin(Window(0, expectedG), time.GetUtcNow()), plan, cancellationToken).ConfigureAwait(false);
        display.Note(NoteKind.Info, $"delivery 1/{plan.Count}: dispense {plan.SelectedVolumeUl:0.###} µL of water (expect about {expectedG * 1000:0.0} mg)");
        await foreach (var e in stream.ReadAsync(cancellationToken).ConfigureAwait(false))
        {
            var action = machine.OnReading(e.Verdict, link.Status == LinkStatus.Connected, false, time.GetUtcNow());
            if (action.Kind == MachineActionKind.Confirm)
            {
                var massMg = action.Decision!.NetReadingG!.Value * 1000;
                massesMg.Add(massMg);
                display.Note(NoteKind.Good, $"delivery {massesMg.Count}/{plan.Count}: {massMg:0.00} mg");
                machine.Recorded(action.GrossG);
                if (massesMg.Count == plan.Count)
                {
                    break;
                }

                action = machine.Begin(Window(massesMg.Count, expectedG), time.GetUtcNow());
                display.Note(NoteKind.Info, $"delivery {massesMg.Count + 1}/{plan.Count}: dispense {plan.SelectedVolumeUl:0.###} µL of water");
            }

            await ExecuteAsync(action, plan, cancellationToken).ConfigureAwait(false);
            Show(plan, machine, e.Verdict, massesMg.Count);
        }

        cancellationToken.ThrowIfCancellationRequested();
        return GravimetricPipetteCheck.Evaluate(plan.Pipette, plan.SelectedVolumeUl, massesMg, plan.TemperatureC, plan.PressureHpa, plan.RelativeHumidityPct);
    }

    /// <summary>Confirms from half to one and a half times the expected water, so a missed or doubled stroke still shows.</summary>
    private static StepWindow Window(int delivery, double expectedG) => new(delivery, expectedG, 0.5 * expectedG, 1.5 * expectedG, 1, null);

    private async Task ExecuteAsync(MachineAction action, PipetteCheckPlan plan, CancellationToken cancellationToken)
    {
        if (action.Kind == MachineActionKind.SendTare && !await link.SendAsync(plan.TareCommand!, cancellationToken).ConfigureAwait(false))
        {
            display.Note(NoteKind.Warning, "could not send the tare command (balance link down)");
        }
    }

    private void Show(PipetteCheckPlan plan, StepMachine machine, StabilityVerdict? verdict, int done)
    {
        var view = new StationView
        {
            BatchId = "pipette check",
            RecipeName = $"gravimetric check of {plan.Pipette.Id} at {plan.SelectedVolumeUl:0.###} µL",
            StepIndex = machine.Window?.StepIndex ?? -1,
            StepNumber = done + 1,
            StepCount = plan.Count,
            ReagentId = "water",
            Phase = machine.Phase,
            TargetNetG = machine.Window?.TargetReadingG,
            LowNetG = machine.Window?.LowReadingG,
            HighNetG = machine.Window?.HighReadingG,
            BaselineG = machine.BaselineG,
            LiveGrossG = verdict?.Reading.Kind == ReadingKind.Weight ? verdict.Reading.ValueG : null,
            ReadingState = verdict is null ? "no reading" : verdict.IsStable ? "stable" : "moving",
            VolumeToDeliverMl = plan.SelectedVolumeUl / 1000,
            TemperatureC = plan.TemperatureC,
            BalanceStatus = link.Status,
            ReadabilityG = plan.ReadabilityG,
            Hint = machine.Reason,
        };
        CurrentView = view;
        display.Show(view);
    }
}
