using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Formats;

/// <summary>Consistency rules for a <see cref="LineFormat"/>, reported all at once with field paths.</summary>
internal static class LineFormatRules
{
    public static void Check(LineFormat format, string fieldPath, bool hasValue, bool hasUnit, bool hasFlag)
    {
        var errors = new List<InputError>();
        if (string.IsNullOrWhiteSpace(format.Name))
        {
            errors.Add(new InputError($"{fieldPath}.name", format.Name ?? "", "a format needs a name"));
        }

        if (!hasValue)
        {
            errors.Add(new InputError($"{fieldPath}.pattern", format.Pattern, "the pattern needs a named group 'value'"));
        }

        if (hasFlag && string.IsNullOrEmpty(format.StableFlag))
        {
            errors.Add(new InputError($"{fieldPath}.stableFlag", format.StableFlag ?? "", "the pattern has a 'flag' group, so the text that means 'stable' is required"));
        }

        if (format.DefaultUnit is { } unit && !MassUnits.IsKnown(unit))
        {
            errors.Add(new InputError($"{fieldPath}.defaultUnit", unit, "unit cannot be converted to g (use g, mg or kg)"));
        }

        if (!hasUnit && format.DefaultUnit is null)
        {
            errors.Add(new InputError($"{fieldPath}.defaultUnit", "", "the pattern has no 'unit' group, so a default unit is required"));
        }

        if (format.MaxLineLength is < 8 or > 4096)
        {
            errors.Add(new InputError($"{fieldPath}.maxLineLength", format.MaxLineLength.ToString(System.Globalization.CultureInfo.InvariantCulture), "must be between 8 and 4096 characters"));
        }

        if (errors.Count > 0)
        {
            throw new InvalidInputException(errors);
        }
    }
}
