using GelDispense.Service.Tests.Infrastructure;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.ScaleOut.Tests.Support;

/// <summary>
/// Recomputes the as-made composition with the chemistry library alone, from the batch as first planned and the
/// readings the test posted, and holds the service's answer to it. The library's own figures are checked against
/// published values in its suite; here the point is that nothing was lost, doubled or mixed up on the way through
/// two replicas.
/// </summary>
internal static class AsMadeCheck
{
    private const double RelativeTolerance = 1e-9;

    public static void MatchesChemistry(Contract.Batch firstPlan, IReadOnlyList<PlannedAddition> posted, Contract.Composition served)
    {
        var expected = LibraryAsMade.Of(firstPlan, posted.Select(a => (a.StepIndex, a.ReadingG)));

        Close(expected.PrecursorMol, served.PrecursorMol, "precursorMol");
        Close(expected.WaterMol, served.WaterMol, "waterMol");
        Close(expected.HydrolysisRatio, served.HydrolysisRatio, "hydrolysisRatio");
        Close(expected.OxideMassG, served.OxideMassG, "oxideMassG");
        Close(expected.OxideDensityGPerMl, served.OxideDensityGPerMl, "oxideDensityGPerMl");
        Close(expected.GelVolumeMl, served.GelVolumeMl, "gelVolumeMl");
    }

    private static void Close(double expected, double actual, string quantity) =>
        Assert.True(Math.Abs(expected - actual) <= RelativeTolerance * Math.Max(1, Math.Abs(expected)),
            $"{quantity}: the service says {actual:R}, the chemistry library {expected:R}");
}
