using System.Globalization;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Chemistry.Planning;

/// <summary>Checks plan options and the spec's tolerances before any allocation runs.</summary>
internal static class PlanOptionsValidation
{
    public static IEnumerable<InputError> Check(PlanOptions options, Formulation f)
    {
        if (!(options.DefaultStepLimitPct is > 0 and <= 50))
        {
            yield return new("options.defaultStepLimitPct", T(options.DefaultStepLimitPct), "a step limit must be above 0 and at most 50 %");
        }

        foreach (var (id, pct) in options.StepLimitPctByReagent)
        {
            if (!(pct is > 0 and <= 50))
            {
                yield return new($"options.stepLimitPctByReagent.{id}", T(pct), "a step limit must be above 0 and at most 50 %");
            }
        }

        if (!(options.VesselTareG >= 0 && double.IsFinite(options.VesselTareG)))
        {
            yield return new("options.vesselTareG", T(options.VesselTareG), "a vessel tare must be zero or a positive number");
        }

        if (options.VesselCapacityMl is { } cap && !(cap > 0 && double.IsFinite(cap)))
        {
            yield return new("options.vesselCapacityMl", T(cap), "a vessel capacity must be a positive number");
        }

        var spec = f.Recipe.Spec;
        foreach (var (field, target) in new[] { ("recipe.spec.hydrolysisRatio", spec?.HydrolysisRatio), ("recipe.spec.oxideDensityGPerMl", spec?.OxideDensityGPerMl) })
        {
            if (target is not null && !(target.Value > 0 && double.IsFinite(target.Value)))
            {
                yield return new($"{field}.value", T(target.Value), "a spec value must be a positive number");
            }

            if (target is not null && !(target.TolerancePct is > 0 and <= 100))
            {
                yield return new($"{field}.tolerancePct", T(target.TolerancePct), "a tolerance must be above 0 and at most 100 %");
            }
        }
    }

    private static string T(double v) => v.ToString("R", CultureInfo.InvariantCulture);
}
