using GelDispense.Chemistry.AsMade;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Mapping;

/// <summary>The library's <see cref="AsMadeReport"/> and <see cref="QuantityDeviation"/> as contract messages.</summary>
public static class AsMadeMapping
{
    public const string NoPrecursorYet = "No precursor has been added yet: R and the oxide density are undefined until one is.";

    /// <summary>The as-made record; a null report means no precursor is in the vessel yet.</summary>
    public static Contract.AsMade ToContract(string batchId, AsMadeReport? report, int stepsDone)
    {
        var asMade = new Contract.AsMade { BatchId = batchId, StepsDone = stepsDone };
        if (report is null)
        {
            asMade.Warnings.Add(NoPrecursorYet);
            return asMade;
        }

        asMade.Composition = CompositionMapping.ToContract(report.Composition);
        asMade.Deviations.AddRange(report.SpecDeviations.Concat(report.RatioDeviations).Select(ToContract));
        asMade.WithinSpec = report.InsideSpec;
        asMade.Complete = report.Complete;
        asMade.Warnings.AddRange(report.Warnings);
        return asMade;
    }

    public static Contract.Deviation ToContract(QuantityDeviation deviation) => new()
    {
        Quantity = deviation.Quantity,
        Nominal = deviation.Nominal,
        Actual = deviation.Actual,
        DeviationPct = deviation.DeviationPct,
        TolerancePct = deviation.TolerancePct,
        WithinTolerance = deviation.WithinTolerance,
    };
}
