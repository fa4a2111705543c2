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
}
