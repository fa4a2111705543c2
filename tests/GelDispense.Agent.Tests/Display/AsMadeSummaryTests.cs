using GelDispense.Agent.Display;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Tests.Display;

public sealed class AsMadeSummaryTests
{
    private static AsMade Sample()
    {
        var asMade = new AsMade { BatchId = "b-1", WithinSpec = false, Complete = true, StepsDone = 2, Composition = new Composition { HydrolysisRatio = 4.1, OxideDensityGPerMl = 0.0895 } };
        asMade.Composition.Components.Add(new ComponentQuantity { ReagentId = "teos", MassG = 20.8, Moles = 0.1, VolumeMl = 22.3 });
        asMade.Deviations.Add(new Deviation { Quantity = "ratio:ethanol", Nominal = 4, Actual = 4.02, DeviationPct = 0.5, TolerancePct = 2, WithinTolerance = true });
        asMade.Deviations.Add(new Deviation { Quantity = "oxideDensityGPerMl", Nominal = 0.09, Actual = 0.0895, DeviationPct = -0.556, TolerancePct = 2, WithinTolerance = true });
        asMade.Deviations.Add(new Deviation { Quantity = "hydrolysisRatio", Nominal = 4, Actual = 4.1, DeviationPct = 2.5, TolerancePct = 2, WithinTolerance = false });
        return asMade;
    }

    [Fact]
    public void R_and_the_oxide_density_lead_the_deviations_each_with_its_flag()
    {
        var summary = AsMadeSummary.From(Sample(), "test sol", "recorded by the service");

        Assert.Equal("R (water : precursor)", summary.Deviations[0][0]);
        Assert.Equal("OUT", summary.Deviations[0][5]);
        Assert.Equal("+2.50 %", summary.Deviations[0][3]);
        Assert.Equal("oxide density / (g/mL)", summary.Deviations[1][0]);
        Assert.Equal("OK", summary.Deviations[1][5]);
        Assert.Equal("ethanol : precursor", summary.Deviations[2][0]);
    }

    [Fact]
    public void The_plain_lines_say_where_the_record_came_from_and_whether_it_is_within_spec()
    {
        var lines = AsMadeSummary.From(Sample(), "test sol", "computed at the station").Lines().ToList();

        Assert.Equal("As-made composition of test sol (computed at the station)", lines[0]);
        Assert.Contains(lines, l => l.Contains("R (water : precursor) = 4.100 mol/mol; oxide density = 0.0895 g/mL", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.Contains("Within spec: NO", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.StartsWith("  teos", StringComparison.Ordinal) && l.Contains("20.8000", StringComparison.Ordinal));
    }
}
