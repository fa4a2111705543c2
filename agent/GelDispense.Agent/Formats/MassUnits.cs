namespace GelDispense.Agent.Formats;

/// <summary>
/// Converts a balance's unit to grams. Only the SI mass units a laboratory balance sends are accepted;
/// anything else (carats, ounces, grains, counting modes, percent) is refused rather than guessed,
/// because a silent wrong number in a dispensing log is worse than a refused line.
/// </summary>
public static class MassUnits
{
    public static bool TryToGrams(double value, ReadOnlySpan<char> unit, out double valueG)
    {
        // Upper-case spellings are accepted because some displays only have capitals; "MG" then
        // can only mean milligrams on a laboratory balance.
        if (unit.SequenceEqual("g") || unit.SequenceEqual("G"))
        {
            valueG = value;
            return true;
        }

        if (unit.SequenceEqual("mg") || unit.SequenceEqual("MG"))
        {
            valueG = value / 1000.0;
            return true;
        }

        if (unit.SequenceEqual("kg") || unit.SequenceEqual("KG"))
        {
            valueG = value * 1000.0;
            return true;
        }

        valueG = double.NaN;
        return false;
    }

    public static bool IsKnown(string unit) => TryToGrams(0, unit, out _);
}
