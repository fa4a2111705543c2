using GelDispense.Chemistry.Errors;

namespace GelDispense.Chemistry.Composition;

/// <summary>Turns recipe amounts (moles, masses, volumes, ratios to precursor) into masses of reagent as supplied.</summary>
internal static class RecipeAmounts
{
    /// <summary>Amounts above this (in any unit) are typing errors, not batches.</summary>
    private const double MaxValue = 1e7;

    public static void Check(Amount amount, int componentIndex, List<InputError> errors)
    {
        // The usual case, settled before any field path is worded.
        if (Enum.IsDefined(amount.Unit) && double.IsFinite(amount.Value) && amount.Value is >= 0 and <= MaxValue)
        {
            return;
        }

        var field = Formulation.ComponentField(componentIndex, "amount");
        if (!Enum.IsDefined(amount.Unit))
        {
            errors.Add(new($"{field}.unit", amount.Unit.ToString(), "unknown unit; use mol, mmol, g, mg, kg, mL, uL, L or ratio"));
        }

        if (!double.IsFinite(amount.Value))
        {
            errors.Add(new($"{field}.value", Formulation.Text(amount.Value), "an amount must be a finite number"));
        }
        else if (amount.Value < 0)
        {
            errors.Add(new($"{field}.value", Formulation.Text(amount.Value), "an amount cannot be negative"));
        }
        else if (amount.Value > MaxValue)
        {
            errors.Add(new($"{field}.value", Formulation.Text(amount.Value), $"an amount above {MaxValue:0e0} is not a plausible batch"));
        }
    }

    public static double[] ToMasses(Recipe recipe, FormulationLine[] lines)
    {
        var masses = new double[lines.Length];
        double absolutePrecursorMol = 0, ratioPrecursor = 0;
        var hasRatio = false;
        for (var i = 0; i < lines.Length; i++)
        {
            var amount = recipe.Components[i].Amount;
            if (amount.Unit == AmountUnit.Ratio)
            {
                hasRatio = true;
                ratioPrecursor += lines[i].Reagent.PrecursorMolPerG > 0 ? amount.Value : 0;
                continue;
            }

            masses[i] = AbsoluteMassG(amount, lines[i]);
            absolutePrecursorMol += masses[i] * lines[i].Reagent.PrecursorMolPerG;
        }

        if (!hasRatio)
        {
            return masses;
        }

        var totalPrecursorMol = TotalPrecursorMol(recipe, absolutePrecursorMol, ratioPrecursor);
        for (var i = 0; i < lines.Length; i++)
        {
            var amount = recipe.Components[i].Amount;
            if (amount.Unit == AmountUnit.Ratio)
            {
                masses[i] = amount.Value * totalPrecursorMol / lines[i].Reagent.ActiveMolPerG;
            }
        }

        return masses;
    }

    /// <summary>
    /// Ratios are per mol of all precursor, so precursors given as ratios share the total with those given
    /// absolutely: N = N_absolute / (1 − Σ r_precursor). With no absolute precursor the ratios must add to 1
    /// and the batch size comes from the scale (a 1 mol basis is used until then).
    /// </summary>
    private static double TotalPrecursorMol(Recipe recipe, double absolutePrecursorMol, double ratioPrecursor)
    {
        if (absolutePrecursorMol > 0)
        {
            if (ratioPrecursor >= 1)
            {
                throw new InvalidInputException("recipe.components", Formulation.Text(ratioPrecursor),
                    "precursor ratios add up to 1 or more while other precursors are given as amounts");
            }

            return absolutePrecursorMol / (1 - ratioPrecursor);
        }

        if (recipe.Scale is null)
        {
            throw new InvalidInputException("recipe.scale", "", "components in 'ratio' units need a scale (gelVolumeMl, precursorMol or oxideMassG) or a precursor given as an amount");
        }

        if (Math.Abs(ratioPrecursor - 1) > 1e-6)
        {
            throw new InvalidInputException("recipe.components", Formulation.Text(ratioPrecursor),
                "when every precursor is given as a ratio, the precursor ratios must add up to 1");
        }

        return 1.0;
    }

    private static double AbsoluteMassG(Amount amount, FormulationLine line) => amount.Unit switch
    {
        AmountUnit.Mol => amount.Value / line.Reagent.ActiveMolPerG,
        AmountUnit.Mmol => amount.Value / 1000.0 / line.Reagent.ActiveMolPerG,
        AmountUnit.G => amount.Value,
        AmountUnit.Mg => amount.Value / 1000.0,
        AmountUnit.Kg => amount.Value * 1000.0,
        AmountUnit.ML => amount.Value * line.DensityGPerMl,
        AmountUnit.UL => amount.Value / 1000.0 * line.DensityGPerMl,
        AmountUnit.L => amount.Value * 1000.0 * line.DensityGPerMl,
        _ => throw new InvalidInputException("amount.unit", amount.Unit.ToString(), "unknown unit"),
    };
}
