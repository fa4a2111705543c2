namespace GelDispense.Agent.Formats;

/// <summary>
/// One parsed balance line. <see cref="ValueG"/> is in grams whatever unit the balance sent, and is null
/// unless <see cref="Kind"/> is <see cref="ReadingKind.Weight"/>. <see cref="Stable"/> is the balance's own
/// stability flag, or null when the line format carries none (software stability then decides).
/// </summary>
public sealed record BalanceReading(double? ValueG, bool? Stable, ReadingKind Kind, string Raw)
{
    public static BalanceReading Marker(ReadingKind kind, string raw) => new(null, false, kind, raw);
}
