using System.Globalization;
using System.Security.Cryptography;
using System.Text;

namespace GelDispense.Service.Storage;

/// <summary>
/// The per-batch hash chain over the event log. Each event's hash is SHA-256 over the previous event's hash and a
/// canonical text of the event: a fixed field order, each field written as name, length and value (so no value can
/// imitate a field boundary), numbers in the invariant culture with round-trip precision. An ADDITION_RECORDED
/// event also covers the stored addition row, so a reading changed in the additions table breaks the chain too; an
/// ADDITION_CORRECTED event covers its correction row the same way (the addition and event it corrects, the readings,
/// the reason, who, where and when). Events of other kinds hash exactly as they did before corrections existed.
/// </summary>
public static class AuditChain
{
    public static string Link(string prevHash, string canonical) =>
        Convert.ToHexString(SHA256.HashData(Encoding.UTF8.GetBytes(prevHash + canonical))).ToLowerInvariant();

    public static string Canonical(EventRow entry, AdditionRow? addition, CorrectionRow? correction = null) =>
        Field(new StringBuilder(), "seq", Number(entry.Seq)).Append(AfterSeq(entry, addition, correction)).ToString();

    /// <summary>
    /// The canonical text after its first field, the sequence number: all a writer can build before the number is
    /// drawn (<see cref="EventLog"/> on PostgreSQL writes the seq field and the hash in SQL, to the same bytes).
    /// </summary>
    public static string AfterSeq(EventRow entry, AdditionRow? addition, CorrectionRow? correction = null)
    {
        var text = new StringBuilder();
        Field(text, "batch_id", entry.BatchId);
        Field(text, "type", entry.Type);
        Field(text, "occurred_at", entry.OccurredAt);
        Field(text, "actor_key_id", entry.ActorKeyId);
        Field(text, "station_id", entry.StationId);
        Field(text, "body", entry.Body);
        Field(text, "addition_id", entry.AdditionId);
        if (addition is not null)
        {
            Field(text, "addition.ordinal", Number(addition.Ordinal));
            Field(text, "addition.step_index", Number(addition.StepIndex));
            Field(text, "addition.reading_g", Number(addition.ReadingG));
            Field(text, "addition.stable", addition.Stable ? "1" : "0");
            Field(text, "addition.source", addition.Source);
            Field(text, "addition.lot_id", addition.LotId);
            Field(text, "addition.true_mass_g", Number(addition.TrueMassG));
            Field(text, "addition.within_window", addition.WithinWindow ? "1" : "0");
            Field(text, "addition.recorded_at", addition.RecordedAt);
            Field(text, "addition.content_hash", addition.ContentHash);
            Field(text, "addition.plan_revision", Number(addition.PlanRevision));
            Field(text, "addition.target_mass_g", Number(addition.TargetMassG));
            Field(text, "addition.acceptance_g", Number(addition.AcceptanceG));
        }

        if (entry.CorrectionId.Length > 0 || correction is not null)
        {
            Field(text, "correction_id", entry.CorrectionId);
        }

        if (correction is not null)
        {
            Field(text, "correction.correction_id", correction.CorrectionId);
            Field(text, "correction.addition_id", correction.AdditionId);
            Field(text, "correction.corrects_seq", Number(correction.CorrectsSeq));
            Field(text, "correction.previous_reading_g", Number(correction.PreviousReadingG));
            Field(text, "correction.reading_g", Number(correction.ReadingG));
            Field(text, "correction.true_mass_g", Number(correction.TrueMassG));
            Field(text, "correction.within_window", correction.WithinWindow ? "1" : "0");
            Field(text, "correction.reason", correction.Reason);
            Field(text, "correction.actor_key_id", correction.ActorKeyId);
            Field(text, "correction.station_id", correction.StationId);
            Field(text, "correction.recorded_at", correction.RecordedAt);
            Field(text, "correction.content_hash", correction.ContentHash);
        }

        return text.ToString();
    }

    private static string Number(long value) => value.ToString(CultureInfo.InvariantCulture);

    // "R" gives the shortest text that parses back to the same double, which both engines store exactly.
    private static string Number(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static StringBuilder Field(StringBuilder text, string name, string value) =>
        text.Append(name).Append(':').Append(value.Length.ToString(CultureInfo.InvariantCulture)).Append(':').Append(value).Append('\n');
}
