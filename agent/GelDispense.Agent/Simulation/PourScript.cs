using System.Globalization;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Simulation;

/// <summary>
/// The technician script on the command line: additions in grams separated by commas, each optionally followed
/// by an over-pour (<c>+10%</c>) or short pour (<c>-2%</c>). Example: <c>5,12.5+10%,3.2-2%</c>.
/// </summary>
public static class PourScript
{
    public static IReadOnlyList<PourStep> Parse(string script, string field = "--script")
    {
        var steps = new List<PourStep>();
        foreach (var raw in script.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
        {
            var split = raw.IndexOfAny(['+', '-'], 1);
            var massText = split < 0 ? raw : raw[..split];
            var fraction = 0.0;
            if (split >= 0)
            {
                var pct = raw[split..].TrimEnd('%');
                if (!raw.EndsWith('%') || !double.TryParse(pct, NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out var percent) || percent is <= -100 or > 1000)
                {
                    throw new InvalidInputException(field, raw, "write an over-pour as +N% or a short pour as -N%, e.g. 12.5+10%");
                }

                fraction = percent / 100;
            }

            if (!double.TryParse(massText, NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out var massG) || massG <= 0)
            {
                throw new InvalidInputException(field, raw, "each addition is a positive mass in grams, e.g. 5 or 12.5");
            }

            steps.Add(new PourStep(massG, fraction));
        }

        return steps.Count > 0 ? steps : throw new InvalidInputException(field, script, "the script names no addition");
    }
}
