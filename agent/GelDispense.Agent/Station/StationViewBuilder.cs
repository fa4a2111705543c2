using GelDispense.Agent.Display;
using GelDispense.Agent.Formats;
using GelDispense.Agent.Links;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Service;
using GelDispense.Agent.Stability;

namespace GelDispense.Agent.Station;

/// <summary>Puts the sequencer's state into a <see cref="StationView"/>; no I/O, so tests can check what is shown.</summary>
public static class StationViewBuilder
{
    public static StationView Build(
        BatchProgress progress, StepMachine machine, StabilityVerdict? verdict, LinkStatus link, ServiceStatus service, int pending, RunSettings settings, double temperatureC)
    {
        var counted = progress.Steps.Where(s => s.TargetMassG > 0).Select(s => s.Index).ToList();
        var view = new StationView
        {
            BatchId = progress.BatchId,
            RecipeName = progress.RecipeName,
            BalanceStatus = link,
            ServiceStatus = service,
            PendingAdditions = pending,
            ReadabilityG = settings.ReadabilityG,
            TemperatureC = temperatureC,
            Phase = machine.Phase,
            Hint = machine.Reason,
            StepCount = counted.Count,
            LiveGrossG = verdict?.Reading.Kind == ReadingKind.Weight ? verdict.Reading.ValueG : null,
            ReadingState = verdict is null ? "no reading"
                : verdict.Reading.Kind != ReadingKind.Weight ? verdict.Reading.Kind.ToString().ToUpperInvariant()
                : verdict.IsStable ? "stable" : "moving",
            DriftGPerMin = verdict?.Drifting == true ? verdict.Drift!.SlopeGPerMin : null,
        };
        if (machine.Window is not { } window)
        {
            return view;
        }

        var step = progress.Step(window.StepIndex);
        return view with
        {
            StepIndex = step.Index,
            StepNumber = counted.IndexOf(step.Index) + 1,
            ReagentId = step.ReagentId,
            LotId = settings.LotOf(step.ReagentId),
            TargetNetG = window.TargetReadingG,
            LowNetG = window.LowReadingG,
            HighNetG = window.HighReadingG,
            BaselineG = machine.BaselineG,
            VolumeToDeliverMl = step.HasTargetVolumeMl ? step.TargetVolumeMl : null,
            DensityGPerMl = window.DensityGPerMl,
            Cautions = [.. step.Cautions],
        };
    }
}
