using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Formulas;

namespace GelDispense.Chemistry.Reagents;

/// <summary>
/// A validated reagent with every per-gram quantity worked out once, so evaluating a recipe is a few
/// multiply-adds per component. All "per g" figures refer to one gram of the reagent as supplied.
/// </summary>
public sealed class PreparedReagent
{
    private const double WaterMolarMassGPerMol = 18.015;

    private PreparedReagent(Reagent definition)
    {
        Definition = definition;
    }

    public Reagent Definition { get; }

    public string Id => Definition.Id;

    public double MolarMassGPerMol { get; private init; }

    /// <summary>Moles of the active substance (the formula) per gram of reagent: assay / M.</summary>
    public double ActiveMolPerG { get; private init; }

    public double PrecursorMolPerG { get; private init; }

    /// <summary>Water from every part of the reagent, the active substance itself when it is water.</summary>
    public double WaterMolPerG { get; private init; }

    public double CatalystMolPerG { get; private init; }

    public double SolventMolPerG { get; private init; }

    public double HydrolysableGroupMolPerG { get; private init; }

    public double OxideGPerG { get; private init; }

    /// <summary>Skeletal volume of the oxide formed per gram of reagent (mL/g).</summary>
    public double OxideSkeletalMlPerG { get; private init; }

    public double AlcoholReleasedMolPerG { get; private init; }

    public double AlcoholReleasedGPerG { get; private init; }

    public ChemicalFormula? OxideFormula { get; private init; }

    /// <summary>Network-forming atoms per oxide unit: everything but O and the organic C and H (1 for SiO2, CH3SiO1.5 and AlO1.5).</summary>
    internal double NetworkAtomsPerOxideUnit { get; private init; }

    internal ReagentHazards Hazards { get; private init; } = null!;

    /// <summary>Prepares a reagent or throws <see cref="InvalidInputException"/> listing every problem under <paramref name="field"/>.</summary>
    public static PreparedReagent Prepare(Reagent reagent, string field = "reagent")
    {
        var errors = new List<InputError>();
        var formula = TryParse(reagent.Formula, $"{field}.formula", errors);
        var assay = reagent.AssayPct / 100.0;
        if (!double.IsFinite(reagent.AssayPct) || reagent.AssayPct <= 0 || reagent.AssayPct > 100)
        {
            errors.Add(new($"{field}.assayPct", Text(reagent.AssayPct), "an assay must be above 0 and at most 100 %"));
        }

        if (string.IsNullOrWhiteSpace(reagent.Id))
        {
            errors.Add(new($"{field}.id", reagent.Id ?? "", "a reagent needs an id"));
        }

        var molarMass = reagent.MolarMassOverrideGPerMol ?? formula?.MolarMassGPerMol ?? double.NaN;
        if (reagent.MolarMassOverrideGPerMol is { } m && (!double.IsFinite(m) || m <= 0))
        {
            errors.Add(new($"{field}.molarMassGPerMol", Text(m), "a molar mass must be a positive number"));
        }

        double waterPerG = 0, solventPerG = 0, fractionSum = assay;
        for (var i = 0; i < reagent.Constituents.Count; i++)
        {
            var c = reagent.Constituents[i];
            var cf = TryParse(c.Formula, $"{field}.constituents[{i}].formula", errors);
            if (!double.IsFinite(c.MassFraction) || c.MassFraction < 0 || c.MassFraction > 1)
            {
                errors.Add(new($"{field}.constituents[{i}].massFraction", Text(c.MassFraction), "a mass fraction must lie between 0 and 1"));
                continue;
            }

            fractionSum += c.MassFraction;
            if (cf is null)
            {
                continue;
            }

            if (c.Role == ReagentRole.Water || IsWater(cf))
            {
                waterPerG += c.MassFraction / WaterMolarMassGPerMol;
            }
            else if (c.Role == ReagentRole.Solvent)
            {
                solventPerG += c.MassFraction / cf.MolarMassGPerMol;
            }
        }

        if (fractionSum > 1 + 1e-9)
        {
            errors.Add(new($"{field}.constituents", Text(fractionSum), "assay and constituent mass fractions add up to more than 1"));
        }

        var precursor = PreparePrecursor(reagent, field, errors);
        CheckDensity(reagent.Density, field, errors);
        if (errors.Count > 0)
        {
            throw new InvalidInputException(errors);
        }

        var activePerG = assay / molarMass;
        var isWater = reagent.Role == ReagentRole.Water || IsWater(formula!);
        var precursorPerG = reagent.Role == ReagentRole.Precursor ? activePerG : 0;
        return new PreparedReagent(reagent)
        {
            MolarMassGPerMol = molarMass,
            ActiveMolPerG = activePerG,
            PrecursorMolPerG = precursorPerG,
            WaterMolPerG = waterPerG + (isWater ? activePerG : 0),
            CatalystMolPerG = reagent.Role == ReagentRole.Catalyst ? activePerG : 0,
            SolventMolPerG = solventPerG + (reagent.Role == ReagentRole.Solvent ? activePerG : 0),
            HydrolysableGroupMolPerG = precursorPerG * (reagent.Precursor?.HydrolysableGroups ?? 0),
            OxideGPerG = precursor is null ? 0 : precursorPerG * reagent.Precursor!.OxidePerMol * precursor.Value.Oxide.MolarMassGPerMol,
            OxideSkeletalMlPerG = precursor is null ? 0
                : precursorPerG * reagent.Precursor!.OxidePerMol * precursor.Value.Oxide.MolarMassGPerMol / reagent.Precursor.OxideSkeletalDensityGPerMl,
            AlcoholReleasedMolPerG = precursorPerG * (reagent.Precursor?.HydrolysableGroups ?? 0),
            AlcoholReleasedGPerG = precursor is null ? 0
                : precursorPerG * reagent.Precursor!.HydrolysableGroups * precursor.Value.Alcohol.MolarMassGPerMol,
            OxideFormula = precursor?.Oxide,
            NetworkAtomsPerOxideUnit = precursor?.Oxide.Atoms.Where(a => a.Key is not ("O" or "C" or "H")).Sum(a => a.Value) ?? 0,
            Hazards = ReagentHazards.Of(reagent),
        };
    }

    private static (ChemicalFormula Oxide, ChemicalFormula Alcohol)? PreparePrecursor(Reagent reagent, string field, List<InputError> errors)
    {
        var p = reagent.Precursor;
        if (p is null)
        {
            if (reagent.Role == ReagentRole.Precursor)
            {
                errors.Add(new($"{field}.precursor", "", "a precursor needs its oxide formula, oxide per mol, hydrolysable groups and skeletal density"));
            }

            return null;
        }

        var oxide = TryParse(p.OxideFormula, $"{field}.precursor.oxideFormula", errors);
        var alcohol = TryParse(p.LeavingAlcoholFormula, $"{field}.precursor.leavingAlcoholFormula", errors);
        if (!double.IsFinite(p.OxidePerMol) || p.OxidePerMol <= 0)
        {
            errors.Add(new($"{field}.precursor.oxidePerMol", Text(p.OxidePerMol), "oxide per mol must be positive"));
        }

        if (p.HydrolysableGroups is < 1 or > 12)
        {
            errors.Add(new($"{field}.precursor.hydrolysableGroups", p.HydrolysableGroups.ToString(System.Globalization.CultureInfo.InvariantCulture), "a precursor has 1 to 12 hydrolysable groups"));
        }

        if (!double.IsFinite(p.OxideSkeletalDensityGPerMl) || p.OxideSkeletalDensityGPerMl <= 0)
        {
            errors.Add(new($"{field}.precursor.oxideSkeletalDensityGPerMl", Text(p.OxideSkeletalDensityGPerMl), "a skeletal density must be positive"));
        }

        return oxide is null || alcohol is null ? null : (oxide, alcohol);
    }

    private static void CheckDensity(DensityModel density, string field, List<InputError> errors)
    {
        if (!(density.MinTemperatureC < density.MaxTemperatureC))
        {
            errors.Add(new($"{field}.density", $"{density.MinTemperatureC}–{density.MaxTemperatureC} °C", "the density's temperature range is empty"));
            return;
        }

        foreach (var t in new[] { density.MinTemperatureC, density.MaxTemperatureC })
        {
            var rho = density.DensityGPerMl(t);
            if (!double.IsFinite(rho) || rho <= 0 || rho > 25)
            {
                errors.Add(new($"{field}.densityGPerMl", Text(rho), $"the density at {Text(t)} °C must lie between 0 and 25 g/mL"));
            }
        }
    }

    private static ChemicalFormula? TryParse(string? text, string field, List<InputError> errors)
    {
        try
        {
            return FormulaParser.Parse(text, field);
        }
        catch (InvalidInputException e)
        {
            errors.AddRange(e.Errors);
            return null;
        }
    }

    private static bool IsWater(ChemicalFormula f) => f.Atoms.Count == 2 && f.Count("H") == 2 && f.Count("O") == 1;

    private static string Text(double v) => v.ToString("R", System.Globalization.CultureInfo.InvariantCulture);
}
