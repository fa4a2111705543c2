using System.Globalization;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Configuration;

/// <summary>Collects every problem in a config before reporting, so one run shows them all.</summary>
internal sealed class ErrorList
{
    private readonly List<InputError> _errors = [];

    public void Add(string field, object? value, string reason) =>
        _errors.Add(new InputError(field, Convert.ToString(value, CultureInfo.InvariantCulture) ?? "", reason));

    public void Require(bool ok, string field, object? value, string reason)
    {
        if (!ok)
        {
            Add(field, value, reason);
        }
    }

    public void AddAll(IEnumerable<InputError> errors) => _errors.AddRange(errors);

    public void ThrowIfAny()
    {
        if (_errors.Count > 0)
        {
            throw new InvalidInputException(_errors);
        }
    }
}
