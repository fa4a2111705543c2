namespace GelDispense.Chemistry.Errors;

/// <summary>
/// One problem with user input: which field (a JSON-style path such as <c>recipe.components[2].amount.unit</c>),
/// the offending value as text, and the reason in plain words. Shells map it to REST problem details
/// and gRPC field violations.
/// </summary>
public sealed record InputError(string Field, string Value, string Reason)
{
    public override string ToString() => $"{Field} = '{Value}': {Reason}";
}
