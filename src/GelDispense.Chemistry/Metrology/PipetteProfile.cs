using GelDispense.Chemistry.Errors;

namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// A single-channel variable-volume air-displacement pipette. Without custom limits its maximum
/// permissible errors come from the ISO 8655-2 table (<see cref="Iso8655"/>); a maker's or the
/// laboratory's own limits, in µL, override the table one by one.
/// </summary>
/// <param name="Id">Asset or station identifier of the pipette.</param>
/// <param name="NominalVolumeUl">Nominal (largest selectable) volume, µL.</param>
/// <param name="MinVolumeUl">Smallest selectable volume, the low end of the useful range, µL.</param>
/// <param name="SystematicMpeUl">Custom maximum permissible systematic error, ± µL.</param>
/// <param name="RandomMpeUl">Custom maximum permissible random error (standard deviation), µL.</param>
public sealed record PipetteProfile(
    string Id,
    double NominalVolumeUl,
    double MinVolumeUl,
    double? SystematicMpeUl = null,
    double? RandomMpeUl = null)
{
    /// <summary>Every problem with this profile; empty when it can be computed with.</summary>
    /// <param name="field">Path of this record in the request, used as the prefix of each field.</param>
    public IReadOnlyList<InputError> Validate(string field = "pipette")
    {
        var errors = new List<InputError>();
        if (string.IsNullOrWhiteSpace(Id))
        {
            errors.Add(new InputError($"{field}.id", Id ?? "null", "must not be empty"));
        }

        InputChecks.Positive(errors, $"{field}.nominalVolumeUl", NominalVolumeUl);
        InputChecks.Positive(errors, $"{field}.minVolumeUl", MinVolumeUl);
        if (MinVolumeUl > NominalVolumeUl)
        {
            errors.Add(new InputError($"{field}.minVolumeUl", InputChecks.Format(MinVolumeUl), "must not exceed the nominal volume"));
        }

        if (SystematicMpeUl is { } systematic)
        {
            InputChecks.Positive(errors, $"{field}.systematicMpeUl", systematic);
        }

        if (RandomMpeUl is { } random)
        {
            InputChecks.Positive(errors, $"{field}.randomMpeUl", random);
        }

        var needsTable = SystematicMpeUl is null || RandomMpeUl is null;
        if (needsTable && double.IsFinite(NominalVolumeUl) && NominalVolumeUl > 0 && !Iso8655.Covers(NominalVolumeUl))
        {
            errors.Add(new InputError($"{field}.nominalVolumeUl", InputChecks.Format(NominalVolumeUl),
                $"is outside the ISO 8655-2 table ({Iso8655.SmallestNominalUl}–{Iso8655.LargestNominalUl} µL); give systematicMpeUl and randomMpeUl"));
        }

        return errors;
    }
}
