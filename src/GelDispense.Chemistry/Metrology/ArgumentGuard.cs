namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// Precondition checks for the metrology functions. Callers validate user input first (the
/// <c>Validate</c> methods return <see cref="Errors.InputError"/> lists), so a failure here is a
/// programming error; it still names the parameter, the value and the accepted range.
/// </summary>
internal static class ArgumentGuard
{
    public static void InRange(double value, double min, double max, string paramName)
    {
        // Written as a negated conjunction so NaN fails too.
        if (!(value >= min && value <= max))
        {
            throw new ArgumentOutOfRangeException(paramName, value, $"must be between {min} and {max}");
        }
    }

    public static void Positive(double value, string paramName)
    {
        if (!(double.IsFinite(value) && value > 0))
        {
            throw new ArgumentOutOfRangeException(paramName, value, "must be a finite number greater than zero");
        }
    }

    public static void Finite(double value, string paramName)
    {
        if (!double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(paramName, value, "must be a finite number");
        }
    }
}
