using System.Globalization;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// Collects <see cref="InputError"/>s for the profile and condition records of this folder, so each
/// <c>Validate</c> reports every problem at once instead of stopping at the first.
/// </summary>
internal static class InputChecks
{
    public static string Format(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    public static void Positive(List<InputError> errors, string field, double value)
    {
        if (!(double.IsFinite(value) && value > 0))
        {
            errors.Add(new InputError(field, Format(value), "must be a finite number greater than zero"));
        }
    }

    public static void InRange(List<InputError> errors, string field, double value, double min, double max)
    {
        if (!(value >= min && value <= max))
        {
            errors.Add(new InputError(
                field,
                Format(value),
                $"must be between {Format(min)} and {Format(max)}"));
        }
    }
}
