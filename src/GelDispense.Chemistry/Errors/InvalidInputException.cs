namespace GelDispense.Chemistry.Errors;

/// <summary>
/// Thrown by the core when input cannot be computed with. It always carries at least one
/// <see cref="InputError"/>, so no caller ever has to parse a message to learn what was wrong.
/// </summary>
public sealed class InvalidInputException : Exception
{
    public InvalidInputException(IReadOnlyList<InputError> errors)
        : base(string.Join("; ", errors))
    {
        if (errors.Count == 0)
        {
            throw new ArgumentException("At least one input error is required.", nameof(errors));
        }

        Errors = errors;
    }

    public InvalidInputException(string field, string value, string reason)
        : this([new InputError(field, value, reason)])
    {
    }

    public IReadOnlyList<InputError> Errors { get; }
}
