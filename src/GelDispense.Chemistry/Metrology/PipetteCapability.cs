using System.Globalization;

namespace GelDispense.Chemistry.Metrology;

/// <summary>What a pipette can deliver, from its maximum permissible errors (ISO 8655-2 or custom).</summary>
public static class PipetteCapability
{
    /// <summary>
    /// The MPEs that apply to <paramref name="p"/>: each custom limit, else the ISO 8655-2 table row.
    /// </summary>
    public static (double SystematicUl, double RandomUl) MaximumPermissibleErrorsUl(PipetteProfile p)
    {
        ArgumentNullException.ThrowIfNull(p);
        if (p.SystematicMpeUl is { } systematic && p.RandomMpeUl is { } random)
        {
            return (systematic, random);
        }

        var table = Iso8655.MaximumPermissibleErrorsUl(p.NominalVolumeUl);
        return (p.SystematicMpeUl ?? table.SystematicUl, p.RandomMpeUl ?? table.RandomUl);
    }

    /// <summary>
    /// Error bound of one delivery, µL: |systematic MPE| + 2 × random MPE. The MPEs are µL at nominal
    /// volume and hold over the whole useful range (ISO 8655-2:2002), so the bound does not shrink
    /// with the selected volume; twice the random limit covers about 95 % of single deliveries.
    /// </summary>
    /// <param name="p">The pipette.</param>
    /// <param name="volumeUl">Selected volume, µL, inside the useful range.</param>
    public static double ExpectedErrorUl(PipetteProfile p, double volumeUl)
    {
        ArgumentNullException.ThrowIfNull(p);
        if (!CanDeliver(p, volumeUl, out var reason))
        {
            throw new ArgumentOutOfRangeException(nameof(volumeUl), volumeUl, reason);
        }

        var (systematicUl, randomUl) = MaximumPermissibleErrorsUl(p);
        return Math.Abs(systematicUl) + (2 * randomUl);
    }

    /// <summary>Whether the volume lies in the pipette's useful range (min to nominal).</summary>
    public static bool CanDeliver(PipetteProfile p, double volumeUl)
    {
        ArgumentNullException.ThrowIfNull(p);
        return double.IsFinite(volumeUl) && volumeUl >= p.MinVolumeUl && volumeUl <= p.NominalVolumeUl;
    }

    /// <summary>Whether the volume lies in the useful range; <paramref name="reason"/> says why not (empty when it does).</summary>
    public static bool CanDeliver(PipetteProfile p, double volumeUl, out string reason)
    {
        reason = !CanDeliver(p, volumeUl)
            ? string.Create(CultureInfo.InvariantCulture,
                $"{volumeUl} µL is outside the useful range {p.MinVolumeUl}–{p.NominalVolumeUl} µL of pipette {p.Id}")
            : string.Empty;
        return reason.Length == 0;
    }
}
