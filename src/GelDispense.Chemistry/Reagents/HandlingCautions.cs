using GelDispense.Chemistry.Formulas;

namespace GelDispense.Chemistry.Reagents;

/// <summary>The kinds of hazard that call for different handling at a weighing station.</summary>
internal enum HazardClass
{
    Flammable,
    Oxidizer,
    Corrosive,
    CorrosiveToMetals,
    HarmfulVapour,
    ToxicOnContact,
    LongTermHealth,
    Aquatic,
    Fluoride,
    Alkoxide,
}

/// <summary>
/// Plain-word handling advice by hazard class (common practice), composed after the hazard statements and
/// closed by one line that defers to the SDS and local rules.
/// </summary>
internal static class HandlingCautions
{
    internal const string DeferToSds = "Before handling, read each supplier's SDS and follow local safety rules; they take precedence over these notes.";

    private static readonly (HazardClass Class, string Advice)[] AdviceInOrder =
    [
        (HazardClass.Flammable, "Flammable: no flames, hot plates or sparks nearby; dispense in a fume hood and close the container between additions."),
        (HazardClass.Oxidizer, "Oxidizer: keep away from combustible material; add it diluted and only in the order the recipe gives."),
        (HazardClass.Corrosive, "Corrosive: wear eye and face protection and resistant gloves; add a concentrated acid or base to the diluent, never the reverse."),
        (HazardClass.CorrosiveToMetals, "Corrodes metal: weigh it in a glass or plastic vessel and wipe any spill off the balance pan at once."),
        (HazardClass.HarmfulVapour, "Harmful or toxic vapour: open and dispense it only in a working fume hood."),
        (HazardClass.ToxicOnContact, "Toxic on skin contact or if swallowed: wear gloves, change them when splashed, wash hands after the batch."),
        (HazardClass.LongTermHealth, "Long-term health hazard (organs, fertility, genes or cancer): keep exposure minimal and follow any site restriction on its use."),
        (HazardClass.Aquatic, "Hazardous to aquatic life: collect residues as chemical waste, nothing down the drain."),
        (HazardClass.Fluoride, "Fluoride: with acid it can release hydrogen fluoride; wear gloves and eye protection and keep calcium gluconate gel available as site rules require."),
        (HazardClass.Alkoxide, "Metal alkoxide: reacts with moisture; keep the bottle closed (under dry gas if available) and wear eye protection."),
    ];

    public static HashSet<HazardClass> ClassesOf(IEnumerable<string> codes)
    {
        var classes = new HashSet<HazardClass>();
        foreach (var code in codes)
        {
            if (ClassOf(code) is { } c)
            {
                classes.Add(c);
            }
        }

        return classes;
    }

    /// <summary>Classes that hazard codes do not express: inorganic fluoride (F without C) and metal alkoxide precursors.</summary>
    public static IEnumerable<HazardClass> ClassesOf(Reagent reagent)
    {
        var formulas = reagent.Constituents.Select(c => c.Formula).Prepend(reagent.Formula);
        if (formulas.Select(f => ChemicalFormula.Parse(f)).Any(f => f.Count("F") > 0 && f.Count("C") == 0))
        {
            yield return HazardClass.Fluoride;
        }

        if (reagent.Precursor is not null)
        {
            yield return HazardClass.Alkoxide;
        }
    }

    /// <summary>One bit per class, so the classes of every reagent in a sol combine with a bitwise or.</summary>
    public static int MaskOf(IEnumerable<HazardClass> classes)
    {
        var mask = 0;
        foreach (var c in classes)
        {
            mask |= 1 << (int)c;
        }

        return mask;
    }

    /// <summary>
    /// Statement lines for the distinct codes in ordinal order, then the advice of each class in <paramref name="classMask"/>,
    /// then the SDS line. Builds the lines in <paramref name="codes"/> itself (sorted, de-duplicated, mapped) and returns it,
    /// so the list handed in becomes the result.
    /// </summary>
    public static List<string> Compose(List<string> codes, int classMask)
    {
        codes.RemoveAll(c => c.Length == 0);
        codes.Sort(StringComparer.Ordinal);
        var count = 0;
        string? previous = null;
        for (var i = 0; i < codes.Count; i++)
        {
            var code = codes[i];
            if (!string.Equals(code, previous, StringComparison.Ordinal))
            {
                codes[count++] = GhsStatements.CautionLine(code);
            }

            previous = code;
        }

        codes.RemoveRange(count, codes.Count - count);
        foreach (var (hazardClass, advice) in AdviceInOrder)
        {
            if ((classMask & (1 << (int)hazardClass)) != 0)
            {
                codes.Add(advice);
            }
        }

        if (codes.Count > 0)
        {
            codes.Add(DeferToSds);
        }

        return codes;
    }

    private static HazardClass? ClassOf(string code) => code switch
    {
        "H220" or "H221" or "H222" or "H223" or "H224" or "H225" or "H226" or "H227" or "H228" => HazardClass.Flammable,
        "H270" or "H271" or "H272" => HazardClass.Oxidizer,
        "H314" or "H318" => HazardClass.Corrosive,
        "H290" => HazardClass.CorrosiveToMetals,
        "H330" or "H331" or "H332" or "H335" or "H336" => HazardClass.HarmfulVapour,
        "H300" or "H301" or "H310" or "H311" => HazardClass.ToxicOnContact,
        _ when code.StartsWith("H34", StringComparison.Ordinal) || code.StartsWith("H35", StringComparison.Ordinal)
            || code.StartsWith("H36", StringComparison.Ordinal) || code.StartsWith("H37", StringComparison.Ordinal) => HazardClass.LongTermHealth,
        _ when code.StartsWith("H40", StringComparison.Ordinal) || code.StartsWith("H41", StringComparison.Ordinal) => HazardClass.Aquatic,
        _ => null,
    };
}
