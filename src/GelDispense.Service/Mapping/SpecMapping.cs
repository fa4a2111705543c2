using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Errors;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Mapping;

/// <summary>The formulation spec from contract to chemistry; each target needs a finite value and a positive tolerance.</summary>
public static class SpecMapping
{
    public static FormulationSpec? ToChemistry(Contract.FormulationSpec? spec, string field, List<InputError> errors)
    {
        if (spec is null)
        {
            return null;
        }

        return new FormulationSpec
        {
            HydrolysisRatio = Target(spec.HydrolysisRatio, $"{field}.hydrolysisRatio", errors),
            OxideDensityGPerMl = Target(spec.OxideDensityGPerMl, $"{field}.oxideDensityGPerMl", errors),
            Ratios = [.. spec.Ratios.Select((r, i) => new RatioSpec(r.ReagentId, Target(r.Target, $"{field}.ratios[{i}].target", errors)
                ?? Missing($"{field}.ratios[{i}].target", errors)))],
            FreeSolventIds = [.. spec.FreeSolventIds],
        };
    }

    private static SpecTarget? Target(Contract.SpecTarget? target, string field, List<InputError> errors)
    {
        if (target is null)
        {
            return null;
        }

        if (!double.IsFinite(target.Value) || target.Value <= 0)
        {
            errors.Add(new InputError($"{field}.value", ReagentMapping.Text(target.Value), "a spec value must be a positive number"));
        }

        if (!double.IsFinite(target.TolerancePct) || target.TolerancePct <= 0 || target.TolerancePct >= 100)
        {
            errors.Add(new InputError($"{field}.tolerancePct", ReagentMapping.Text(target.TolerancePct), "a tolerance must be above 0 and below 100 %"));
        }

        return new SpecTarget(target.Value, target.TolerancePct);
    }

    private static SpecTarget Missing(string field, List<InputError> errors)
    {
        errors.Add(new InputError(field, "", "a ratio spec needs a target { value, tolerancePct }"));
        return new SpecTarget(0, 0);
    }
}
