using System.Globalization;
using GelDispense.Agent.Display;
using GelDispense.Chemistry.Metrology;

namespace GelDispense.Agent.Calibration;

/// <summary>The result of a pipette check in words, each error beside its ISO 8655-2 limit.</summary>
public static class PipetteCheckText
{
    public static IEnumerable<string> Lines(PipetteCheckResult r)
    {
        yield return F($"Gravimetric check of pipette {r.PipetteId} at {r.SelectedVolumeUl:0.###} µL: {r.Count} deliveries, Z = {r.ZFactorUlPerMg:0.0000} µL/mg (ISO 8655-6)");
        yield return F($"  mean volume      {r.MeanVolumeUl,10:0.000} µL");
        yield return F($"  systematic error {Grams.Signed(r.SystematicErrorUl, 3),10} µL ({Grams.Signed(r.SystematicErrorPct, 2)} %)  limit ± {r.SystematicMpeUl:0.###} µL  {Flag(r.SystematicPass)}");
        yield return F($"  random error (s) {r.RandomErrorUl,10:0.000} µL (CV {r.RandomErrorCvPct:0.00} %)  limit {r.RandomMpeUl:0.###} µL  {Flag(r.RandomPass)}");
        yield return r.Passed ? "  Result: PASS against the ISO 8655-2 maximum permissible errors." : "  Result: FAIL against the ISO 8655-2 maximum permissible errors; take the pipette out of use and have it adjusted.";
        if (r.Count < 10)
        {
            yield return "  Note: ISO 8655-6 calls for 10 deliveries per volume (from memory); fewer make a quick station check only.";
        }
    }

    private static string Flag(bool pass) => pass ? "pass" : "FAIL";

    private static string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
