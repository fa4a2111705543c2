using GelDispense.Chemistry.Errors;
using GelDispense.Contracts.V1;
using GelDispense.Service.Mapping;

namespace GelDispense.Service.Batches;

/// <summary>Checks a correction request at the edge; every fault names the field, the value and why.</summary>
public static class CorrectionInput
{
    public const int MaxIdLength = 64;
    public const int MaxReasonLength = 500;

    /// <summary>The trimmed reason when the request is sound; else every fault at once.</summary>
    public static string Validate(CorrectAdditionRequest request)
    {
        var errors = new List<InputError>();
        if (request.CorrectionId.Trim().Length is 0 || request.CorrectionId.Length > MaxIdLength)
        {
            errors.Add(new InputError("correctionId", RecipeMapping.Clip(request.CorrectionId),
                $"a correction id (the idempotency key) has 1 to {MaxIdLength} characters"));
        }

        if (request.AdditionId.Trim().Length is 0 || request.AdditionId.Length > MaxIdLength)
        {
            errors.Add(new InputError("additionId", RecipeMapping.Clip(request.AdditionId), $"an addition id has 1 to {MaxIdLength} characters"));
        }

        if (!double.IsFinite(request.ReadingG) || request.ReadingG < 0)
        {
            errors.Add(new InputError("readingG", ReagentMapping.Text(request.ReadingG),
                "a corrected reading must be a finite number of zero or more grams, as the balance showed it"));
        }

        var reason = request.Reason.Trim();
        if (reason.Length is 0 or > MaxReasonLength)
        {
            errors.Add(new InputError("reason", RecipeMapping.Clip(request.Reason),
                $"say why the reading is corrected, in 1 to {MaxReasonLength} characters (not only spaces)"));
        }

        return errors.Count == 0 ? reason : throw new InvalidInputException(errors);
    }
}
