using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Reagents;

namespace GelDispense.Service.Mapping;

/// <summary>
/// The words the contract uses for units and roles. Strings rather than proto enums, so a bad value comes back
/// as a field violation naming the accepted words instead of a JSON parse failure.
/// </summary>
public static class UnitNames
{
    public const string AcceptedUnits = "mol, mmol, g, mg, kg, mL, uL, L, ratio";
    public const string AcceptedRoles = "precursor, solvent, water, catalyst, additive";

    public static AmountUnit? ParseUnit(string text) => text.Trim() switch
    {
        "mol" => AmountUnit.Mol,
        "mmol" => AmountUnit.Mmol,
        "g" => AmountUnit.G,
        "mg" => AmountUnit.Mg,
        "kg" => AmountUnit.Kg,
        "mL" or "ml" => AmountUnit.ML,
        "uL" or "ul" or "µL" => AmountUnit.UL,
        "L" or "l" => AmountUnit.L,
        "ratio" => AmountUnit.Ratio,
        _ => null,
    };

    public static string Name(AmountUnit unit) => unit switch
    {
        AmountUnit.ML => "mL",
        AmountUnit.UL => "uL",
        AmountUnit.L => "L",
        _ => unit.ToString().ToLowerInvariant(),
    };

    public static ReagentRole? ParseRole(string text) =>
        Enum.TryParse<ReagentRole>(text.Trim(), ignoreCase: true, out var role) && Enum.IsDefined(role) && !int.TryParse(text, out _)
            ? role
            : null;

    public static string Name(ReagentRole role) => role.ToString().ToLowerInvariant();
}
