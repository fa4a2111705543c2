using System.Collections.Frozen;

namespace GelDispense.Chemistry.Reagents;

/// <summary>
/// GHS hazard statement codes and their standard English wording (UN GHS, Annex 3; the letter-suffixed
/// reproductive-toxicity codes are the EU CLP refinements), and the caution lines a station shows beside a step.
/// </summary>
public static class GhsStatements
{
    private static readonly FrozenDictionary<string, string> ByCode = new Dictionary<string, string>
    {
        ["H220"] = "Extremely flammable gas",
        ["H221"] = "Flammable gas",
        ["H222"] = "Extremely flammable aerosol",
        ["H223"] = "Flammable aerosol",
        ["H224"] = "Extremely flammable liquid and vapour",
        ["H225"] = "Highly flammable liquid and vapour",
        ["H226"] = "Flammable liquid and vapour",
        ["H227"] = "Combustible liquid",
        ["H228"] = "Flammable solid",
        ["H240"] = "Heating may cause an explosion",
        ["H241"] = "Heating may cause a fire or explosion",
        ["H242"] = "Heating may cause a fire",
        ["H250"] = "Catches fire spontaneously if exposed to air",
        ["H251"] = "Self-heating; may catch fire",
        ["H252"] = "Self-heating in large quantities; may catch fire",
        ["H260"] = "In contact with water releases flammable gases which may ignite spontaneously",
        ["H261"] = "In contact with water releases flammable gas",
        ["H270"] = "May cause or intensify fire; oxidizer",
        ["H271"] = "May cause fire or explosion; strong oxidizer",
        ["H272"] = "May intensify fire; oxidizer",
        ["H280"] = "Contains gas under pressure; may explode if heated",
        ["H281"] = "Contains refrigerated gas; may cause cryogenic burns or injury",
        ["H290"] = "May be corrosive to metals",
        ["H300"] = "Fatal if swallowed",
        ["H301"] = "Toxic if swallowed",
        ["H302"] = "Harmful if swallowed",
        ["H303"] = "May be harmful if swallowed",
        ["H304"] = "May be fatal if swallowed and enters airways",
        ["H305"] = "May be harmful if swallowed and enters airways",
        ["H310"] = "Fatal in contact with skin",
        ["H311"] = "Toxic in contact with skin",
        ["H312"] = "Harmful in contact with skin",
        ["H313"] = "May be harmful in contact with skin",
        ["H314"] = "Causes severe skin burns and eye damage",
        ["H315"] = "Causes skin irritation",
        ["H316"] = "Causes mild skin irritation",
        ["H317"] = "May cause an allergic skin reaction",
        ["H318"] = "Causes serious eye damage",
        ["H319"] = "Causes serious eye irritation",
        ["H320"] = "Causes eye irritation",
        ["H330"] = "Fatal if inhaled",
        ["H331"] = "Toxic if inhaled",
        ["H332"] = "Harmful if inhaled",
        ["H333"] = "May be harmful if inhaled",
        ["H334"] = "May cause allergy or asthma symptoms or breathing difficulties if inhaled",
        ["H335"] = "May cause respiratory irritation",
        ["H336"] = "May cause drowsiness or dizziness",
        ["H340"] = "May cause genetic defects",
        ["H341"] = "Suspected of causing genetic defects",
        ["H350"] = "May cause cancer",
        ["H351"] = "Suspected of causing cancer",
        ["H360"] = "May damage fertility or the unborn child",
        ["H360D"] = "May damage the unborn child",
        ["H360F"] = "May damage fertility",
        ["H361"] = "Suspected of damaging fertility or the unborn child",
        ["H361d"] = "Suspected of damaging the unborn child",
        ["H361f"] = "Suspected of damaging fertility",
        ["H362"] = "May cause harm to breast-fed children",
        ["H370"] = "Causes damage to organs",
        ["H371"] = "May cause damage to organs",
        ["H372"] = "Causes damage to organs through prolonged or repeated exposure",
        ["H373"] = "May cause damage to organs through prolonged or repeated exposure",
        ["H400"] = "Very toxic to aquatic life",
        ["H401"] = "Toxic to aquatic life",
        ["H402"] = "Harmful to aquatic life",
        ["H410"] = "Very toxic to aquatic life with long lasting effects",
        ["H411"] = "Toxic to aquatic life with long lasting effects",
        ["H412"] = "Harmful to aquatic life with long lasting effects",
        ["H413"] = "May cause long lasting harmful effects to aquatic life",
        ["H420"] = "Harms public health and the environment by destroying ozone in the upper atmosphere",
    }.ToFrozenDictionary(StringComparer.Ordinal);

    /// <summary>The caution line of each known code, formatted once: every composition and plan step shows them.</summary>
    private static readonly FrozenDictionary<string, string> LineByCode =
        ByCode.ToFrozenDictionary(e => e.Key, e => $"{e.Key}: {e.Value}.", StringComparer.Ordinal);

    /// <summary>Every code this table knows.</summary>
    public static IEnumerable<string> Codes => ByCode.Keys;

    /// <summary>The hazard statement of a code; the code's letters after "H" and its digits are case-sensitive (H361d ≠ H361D).</summary>
    public static bool TryGetStatement(string code, out string statement) =>
        ByCode.TryGetValue(Normalize(code), out statement!);

    /// <summary>Caution lines for hazard codes alone: one line per code, then plain-word handling advice.</summary>
    public static IReadOnlyList<string> Cautions(IEnumerable<string> codes)
    {
        var normalized = codes.Select(Normalize).ToList();
        return HandlingCautions.Compose(normalized, HandlingCautions.MaskOf(HandlingCautions.ClassesOf(normalized)));
    }

    /// <summary>
    /// Caution lines for the reagents of a sol: their codes plus the advice that codes cannot carry
    /// (inorganic fluoride forms HF with acids; metal alkoxides are moisture-sensitive).
    /// </summary>
    public static IReadOnlyList<string> Cautions(IEnumerable<PreparedReagent> reagents)
    {
        List<string>? codes = null;
        var classMask = 0;
        PreparedReagent? first = null;
        foreach (var r in reagents)
        {
            first ??= r;
            if (codes is null && !ReferenceEquals(r, first))
            {
                codes = [.. first.Hazards.Codes];
            }

            codes?.AddRange(r.Hazards.Codes);
            classMask |= r.Hazards.ClassMask;
        }

        // One reagent, however often listed, has the lines it was prepared with.
        return codes is not null ? HandlingCautions.Compose(codes, classMask) : first?.Hazards.Cautions ?? [];
    }

    /// <summary>"H225: Highly flammable liquid and vapour." for a known code, else a line that sends the reader to the SDS.</summary>
    internal static string CautionLine(string code) =>
        LineByCode.TryGetValue(code, out var line) ? line : $"{code}: not a hazard code known here; see the SDS.";

    internal static string Normalize(string code)
    {
        var trimmed = (code ?? "").Trim();
        return trimmed.StartsWith('h') ? "H" + trimmed[1..] : trimmed;
    }
}
