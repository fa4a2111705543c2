using GelDispense.Chemistry.Errors;

namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// What is known about the balance of a station. Only readability and capacity are required; a
/// measured repeatability, a user-set minimum weight and the legal-metrology class sharpen the
/// capability checks of <see cref="BalanceCapability"/>.
/// </summary>
/// <param name="ReadabilityG">Scale interval d (the last digit shown), g.</param>
/// <param name="CapacityG">Maximum capacity Max, g.</param>
/// <param name="RepeatabilityG">Standard deviation s of at least 10 replicate weighings (USP &lt;41&gt;), g.</param>
/// <param name="MinimumWeightG">Minimum net weight the laboratory set for this balance, g.</param>
/// <param name="AccuracyClass">OIML R 76 accuracy class, when the balance is verified.</param>
/// <param name="VerificationIntervalG">Verification scale interval e, g; required with a class.</param>
public sealed record BalanceProfile(
    double ReadabilityG,
    double CapacityG,
    double? RepeatabilityG = null,
    double? MinimumWeightG = null,
    AccuracyClass? AccuracyClass = null,
    double? VerificationIntervalG = null)
{
    /// <summary>Every problem with this profile; empty when it can be computed with.</summary>
    /// <param name="field">Path of this record in the request, used as the prefix of each field.</param>
    public IReadOnlyList<InputError> Validate(string field = "balance")
    {
        var errors = new List<InputError>();
        InputChecks.Positive(errors, $"{field}.readabilityG", ReadabilityG);
        InputChecks.Positive(errors, $"{field}.capacityG", CapacityG);
        if (errors.Count == 0 && CapacityG <= ReadabilityG)
        {
            errors.Add(new InputError($"{field}.capacityG", InputChecks.Format(CapacityG), "must exceed the readability"));
        }

        // s = 0 is a real outcome (ten identical readings); USP <41> then floors s at 0.41 d.
        if (RepeatabilityG is { } s && !(double.IsFinite(s) && s >= 0))
        {
            errors.Add(new InputError($"{field}.repeatabilityG", InputChecks.Format(s), "must be a finite number of zero or more"));
        }

        if (MinimumWeightG is { } minimum)
        {
            var before = errors.Count;
            InputChecks.Positive(errors, $"{field}.minimumWeightG", minimum);
            if (errors.Count == before && minimum > CapacityG)
            {
                errors.Add(new InputError($"{field}.minimumWeightG", InputChecks.Format(minimum), "must not exceed the capacity"));
            }
        }

        ValidateClass(errors, field);
        return errors;
    }

    private void ValidateClass(List<InputError> errors, string field)
    {
        var intervalField = $"{field}.verificationIntervalG";
        switch (AccuracyClass, VerificationIntervalG)
        {
            case (null, null):
                return;
            case ({ } c, _) when !Enum.IsDefined(c):
                errors.Add(new InputError($"{field}.accuracyClass", c.ToString(), "is not an OIML R 76 accuracy class (I, II, III, IIII)"));
                return;
            case (not null, null):
                errors.Add(new InputError(intervalField, "null", "is required when an accuracy class is given: the R 76 mpe is a multiple of e"));
                return;
            case (null, { } e):
                errors.Add(new InputError($"{field}.accuracyClass", "null", $"is required when a verification interval ({InputChecks.Format(e)} g) is given"));
                return;
            case ({ } c, { } e):
                ValidateInterval(errors, intervalField, c, e);
                return;
        }
    }

    private void ValidateInterval(List<InputError> errors, string intervalField, AccuracyClass c, double e)
    {
        var before = errors.Count;
        InputChecks.Positive(errors, intervalField, e);
        if (errors.Count > before || !(double.IsFinite(ReadabilityG) && ReadabilityG > 0))
        {
            return;
        }

        // e is d or a decade multiple of it (R 76-1, from memory); e < d cannot be verified.
        if (e < ReadabilityG)
        {
            errors.Add(new InputError(intervalField, InputChecks.Format(e), $"must not be smaller than the readability ({InputChecks.Format(ReadabilityG)} g)"));
        }
        else if (CapacityG / e > OimlR76.MaximumLoadIntervals(c) * (1 + OimlR76.EdgeSlack))
        {
            errors.Add(new InputError(intervalField, InputChecks.Format(e),
                $"gives Max/e above {OimlR76.MaximumLoadIntervals(c)}, beyond the R 76 mpe table of class {c}"));
        }
    }
}
