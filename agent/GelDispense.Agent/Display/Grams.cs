using System.Globalization;

namespace GelDispense.Agent.Display;

/// <summary>Numbers as the technician reads them: grams to the balance's readability, and a few fixed formats.</summary>
public static class Grams
{
    public static string Text(double? valueG, double readabilityG)
    {
        if (valueG is not { } v)
        {
            return "—";
        }

        var decimals = Math.Clamp((int)Math.Ceiling(-Math.Log10(readabilityG) - 1e-9), 0, 6);
        return v.ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture) + " g";
    }

    public static string Number(double value, string format) => value.ToString(format, CultureInfo.InvariantCulture);

    /// <summary>A signed figure, "+1.25" or "-0.40", and "0.00" for anything that rounds to zero (a section format alone
    /// writes a tiny negative number as "-+0.00").</summary>
    public static string Signed(double value, int decimals)
    {
        var digits = decimals > 0 ? "0." + new string('0', decimals) : "0";
        var rounded = Math.Round(value, decimals);
        return rounded == 0 ? 0.0.ToString(digits, CultureInfo.InvariantCulture) : rounded.ToString($"+{digits};-{digits}", CultureInfo.InvariantCulture);
    }
}
