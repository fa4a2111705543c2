using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Tolerances;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Mapping;

/// <summary>Plan options from the contract; the library checks the numbers (fields named <c>options.…</c>).</summary>
public static class PlanOptionsMapping
{
    public static readonly string[] ToleranceModes = ["worst-case", "root-sum-square"];

    public static PlanOptions ToChemistry(Contract.PlanOptions? options)
    {
        var defaults = new PlanOptions();
        if (options is null)
        {
            return defaults;
        }

        var mode = options.ToleranceMode.Trim().ToLowerInvariant() switch
        {
            "" or "worst-case" => ToleranceMode.WorstCase,
            "root-sum-square" => ToleranceMode.RootSumSquare,
            _ => throw new InvalidInputException("options.toleranceMode", RecipeMapping.Clip(options.ToleranceMode),
                $"unknown tolerance mode; use {string.Join(" or ", ToleranceModes)}"),
        };
        return new PlanOptions
        {
            Mode = mode,
            Cumulative = options.Cumulative,
            DefaultStepLimitPct = options.HasDefaultStepLimitPct ? options.DefaultStepLimitPct : defaults.DefaultStepLimitPct,
            StepLimitPctByReagent = options.StepLimitPctByReagent.ToDictionary(p => p.Key, p => p.Value, StringComparer.Ordinal),
            VolumetricReagentIds = [.. options.VolumetricReagentIds],
            VesselTareG = options.VesselTareG,
            VesselCapacityMl = options.HasVesselCapacityMl ? options.VesselCapacityMl : null,
        };
    }
}
