using System.Globalization;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Reagents;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Mapping;

/// <summary>Reagents between the contract and the chemistry library. Checks here cover only what the library cannot see (words, presence).</summary>
public static class ReagentMapping
{
    /// <summary>The chemistry reagent; problems go to <paramref name="errors"/> (null when there is no reagent at all).</summary>
    public static Reagent? ToChemistry(Contract.Reagent? reagent, string field, List<InputError> errors)
    {
        if (reagent is null)
        {
            errors.Add(new InputError(field, "", "a reagent is required"));
            return null;
        }

        var role = UnitNames.ParseRole(reagent.Role);
        if (role is null)
        {
            errors.Add(new InputError($"{field}.role", reagent.Role, $"unknown role; use one of {UnitNames.AcceptedRoles}"));
        }

        return new Reagent
        {
            Id = reagent.Id,
            Name = string.IsNullOrWhiteSpace(reagent.Name) ? reagent.Id : reagent.Name,
            Formula = reagent.Formula,
            Role = role ?? ReagentRole.Additive,
            Density = new LinearDensity(
                reagent.DensityGPerMl,
                reagent.HasDensityRefTempC ? reagent.DensityRefTempC : 20,
                reagent.HasDensityTempCoeffGPerMlPerK ? reagent.DensityTempCoeffGPerMlPerK : 0),
            MolarMassOverrideGPerMol = reagent.HasMolarMassGPerMol ? reagent.MolarMassGPerMol : null,
            AssayPct = reagent.HasAssayPct ? reagent.AssayPct : 100,
            Precursor = reagent.Precursor is { } p
                ? new PrecursorData(p.OxideFormula, p.OxidePerMol, p.HydrolysableGroups, p.OxideSkeletalDensityGPerMl, p.LeavingAlcoholFormula)
                : null,
            Constituents = [.. reagent.Constituents.Select((c, i) => Constituent(c, $"{field}.constituents[{i}]", errors))],
            GhsHazards = [.. reagent.GhsHazards],
            Source = reagent.Source,
        };
    }

    public static Contract.Reagent ToContract(Reagent reagent, bool builtIn)
    {
        var contract = new Contract.Reagent
        {
            Id = reagent.Id,
            Name = reagent.Name,
            Formula = reagent.Formula,
            Role = UnitNames.Name(reagent.Role),
            AssayPct = reagent.AssayPct,
            BuiltIn = builtIn,
            Source = reagent.Source,
        };
        switch (reagent.Density)
        {
            case LinearDensity linear:
                contract.DensityModel = "linear";
                contract.DensityGPerMl = linear.ReferenceDensityGPerMl;
                contract.DensityRefTempC = linear.ReferenceTemperatureC;
                contract.DensityTempCoeffGPerMlPerK = linear.CoefficientGPerMlPerK;
                break;
            default:
                // Non-linear models (water by Tanaka 2001, tables) are reported by their value at 20 °C.
                contract.DensityModel = reagent.Density is WaterDensityModel ? "tanaka-2001" : "table";
                contract.DensityGPerMl = reagent.Density.DensityGPerMl(20);
                contract.DensityRefTempC = 20;
                break;
        }

        if (reagent.MolarMassOverrideGPerMol is { } molarMass)
        {
            contract.MolarMassGPerMol = molarMass;
        }

        if (reagent.Precursor is { } p)
        {
            contract.Precursor = new Contract.PrecursorData
            {
                OxideFormula = p.OxideFormula,
                OxidePerMol = p.OxidePerMol,
                HydrolysableGroups = p.HydrolysableGroups,
                OxideSkeletalDensityGPerMl = p.OxideSkeletalDensityGPerMl,
                LeavingAlcoholFormula = p.LeavingAlcoholFormula,
            };
        }

        contract.Constituents.AddRange(reagent.Constituents.Select(c => new Contract.SolutionConstituent
        {
            Formula = c.Formula,
            MassFraction = c.MassFraction,
            Role = UnitNames.Name(c.Role),
        }));
        contract.GhsHazards.AddRange(reagent.GhsHazards);
        return contract;
    }

    private static SolutionConstituent Constituent(Contract.SolutionConstituent c, string field, List<InputError> errors)
    {
        // Water is by far the usual constituent, so an empty role on H2O means water.
        var role = c.Role.Length == 0 && c.Formula.Trim() == "H2O" ? ReagentRole.Water : UnitNames.ParseRole(c.Role);
        if (role is null or ReagentRole.Precursor)
        {
            errors.Add(new InputError($"{field}.role", c.Role, $"unknown constituent role; use one of solvent, water, catalyst, additive"));
        }

        return new SolutionConstituent(c.Formula, c.MassFraction, role ?? ReagentRole.Additive);
    }

    internal static string Text(double value) => value.ToString("R", CultureInfo.InvariantCulture);
}
