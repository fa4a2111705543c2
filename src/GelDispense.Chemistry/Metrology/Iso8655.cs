namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// ISO 8655-2 maximum permissible errors of single-channel variable-volume air-displacement
/// pipettes, at the nominal volume. As in the 2002 edition, the limits in µL apply over the whole
/// useful range, not as a percentage of the selected volume (manufacturer note and TSI 2019 paper).
/// Only the 1000 µL row is confirmed in a public document; every other row is from memory, as is
/// the assumption that the 2022 edition kept the numbers.
/// </summary>
public static class Iso8655
{
    // (nominal µL, systematic ± µL, random (s) µL)
    private static readonly (double NominalUl, double SystematicUl, double RandomUl)[] Rows =
    [
        (1, 0.05, 0.05),      // from memory
        (2, 0.08, 0.04),      // from memory
        (5, 0.125, 0.075),    // from memory
        (10, 0.12, 0.08),     // from memory
        (20, 0.2, 0.1),       // from memory
        (50, 0.5, 0.2),       // from memory
        (100, 0.8, 0.3),      // from memory
        (200, 1.6, 0.6),      // from memory
        (500, 4, 1.5),        // from memory
        (1000, 8, 3),         // TSI 2019 paper Table 2; a pipette maker's ISO 8655 note
        (2000, 16, 6),        // from memory
        (5000, 40, 15),       // from memory
        (10000, 60, 30),      // from memory
    ];

    /// <summary>Smallest nominal volume in the table, µL.</summary>
    public const double SmallestNominalUl = 1;

    /// <summary>Largest nominal volume in the table, µL.</summary>
    public const double LargestNominalUl = 10000;

    /// <summary>Whether the table gives limits for this nominal volume.</summary>
    public static bool Covers(double nominalVolumeUl) =>
        nominalVolumeUl >= SmallestNominalUl && nominalVolumeUl <= LargestNominalUl;

    /// <summary>
    /// Systematic (± µL) and random (standard deviation, µL) MPE for a pipette of this nominal volume.
    /// A nominal between two rows takes the µL limits of the next larger row. That is our rule, not
    /// the standard's: it never states a pipette's error smaller than a listed neighbour does, so the
    /// capability checks that use it stay on the safe side (a 300 µL pipette gets ±4 µL, not the
    /// 0.8 % × 300 = 2.4 µL of the row below).
    /// </summary>
    /// <param name="nominalVolumeUl">Nominal volume, µL, 1–10 000.</param>
    public static (double SystematicUl, double RandomUl) MaximumPermissibleErrorsUl(double nominalVolumeUl)
    {
        ArgumentGuard.InRange(nominalVolumeUl, SmallestNominalUl, LargestNominalUl, nameof(nominalVolumeUl));
        var row = Rows.First(r => r.NominalUl >= nominalVolumeUl);
        return (row.SystematicUl, row.RandomUl);
    }
}
