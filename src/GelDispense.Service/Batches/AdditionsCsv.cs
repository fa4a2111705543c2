using System.Globalization;
using System.Text;
using GelDispense.Contracts.V1;

namespace GelDispense.Service.Batches;

/// <summary>
/// The CSV export: one row per addition, RFC 4180 quoting, units in the column names, invariant culture
/// (decimal point, ISO 8601 UTC times) so any LIMS or spreadsheet reads it the same way. Each row carries the
/// target and acceptance band its addition was judged against (its plan revision), which a later re-plan does not move.
/// A corrected addition keeps its one row: reading_g, true_mass_g and within_window give the latest correction, and
/// the columns after recorded_at_utc keep the first reading and say how often, when, by whom and why it was corrected
/// (added at the end so readers that take columns by position keep working).
/// </summary>
public static class AdditionsCsv
{
    public const string Header =
        "batch_id,station_id,batch_status,recipe_name,recipe_revision,addition_id,step_index,reagent_id,lot_id," +
        "reading_g,true_mass_g,plan_revision,target_mass_g,acceptance_g,within_window,stable,source,recorded_at_utc," +
        "original_reading_g,correction_count,latest_correction_id,corrected_at_utc,corrected_by_key_id,correction_reason";

    public static void AppendRows(StringBuilder csv, Batch batch)
    {
        var steps = batch.Steps.ToDictionary(s => s.Index);
        foreach (var a in batch.Additions)
        {
            var step = steps.GetValueOrDefault(a.StepIndex);
            string[] fields =
            [
                batch.Id, batch.StationId, batch.Status.ToString(), batch.RecipeName, Number(batch.RecipeRevision), a.AdditionId,
                Number(a.StepIndex), step?.ReagentId ?? "", a.LotId, Number(a.ReadingG), Number(a.TrueMassG),
                Number(a.PlanRevision), Number(a.TargetMassG), Number(a.AcceptanceG),
                a.WithinWindow ? "true" : "false", a.Stable ? "true" : "false", a.Source,
                Time(a.RecordedAt), Number(a.OriginalReadingG), Number(a.CorrectionCount), a.LatestCorrection?.CorrectionId ?? "",
                a.LatestCorrection is { } c ? Time(c.CorrectedAt) : "", a.LatestCorrection?.ActorKeyId ?? "", a.LatestCorrection?.Reason ?? "",
            ];
            csv.AppendJoin(',', fields.Select(Quote)).Append("\r\n");
        }
    }

    private static string Number(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static string Time(Google.Protobuf.WellKnownTypes.Timestamp at) =>
        at.ToDateTimeOffset().UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.ffffff'Z'", CultureInfo.InvariantCulture);

    private static string Number(int value) => value.ToString(CultureInfo.InvariantCulture);

    private static string Quote(string field) =>
        field.IndexOfAny([',', '"', '\r', '\n']) < 0 ? field : $"\"{field.Replace("\"", "\"\"", StringComparison.Ordinal)}\"";
}
