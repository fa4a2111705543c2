using GelDispense.Contracts.V1;
using GelDispense.Service.Storage;
using Google.Protobuf;
using Npgsql;
using NpgsqlTypes;

namespace GelDispense.Benchmarks.Service;

/// <summary>
/// Fills a migrated PostgreSQL database with a station history in bulk (binary COPY): batches made on 40 stations,
/// eight at a time every 45 minutes, each with <see cref="AdditionsPerBatch"/> additions and its event log,
/// hash-chained as the service chains it. Every batch repeats the recipe revision, setup and plan of a template
/// batch the service created itself, so a LIMS page parses real stored JSON; the template then makes way. The
/// stored replay response of an addition is a short stand-in: the LIMS page never reads it. Vacuumed, analysed and
/// checkpointed at the end, as a database that has stood for a while would be.
/// </summary>
public static class HistorySeeder
{
    public const int AdditionsPerBatch = 10;
    public const int StationCount = 40;
    private const int Concurrent = 8;
    private static readonly DateTimeOffset HistoryStart = new(2025, 6, 2, 7, 0, 0, TimeSpan.Zero);
    private static readonly TimeSpan GroupSpacing = TimeSpan.FromMinutes(45);

    public static async Task<SeededHistory> SeedAsync(string connectionString, string templateId, int additions)
    {
        await using var connection = new NpgsqlConnection(connectionString);
        await connection.OpenAsync();
        var template = await TemplateAsync(connection, templateId);
        var steps = JsonParser.Default.Parse<DispensingPlan>(template.Plan).Steps;
        var groups = Groups(additions / AdditionsPerBatch, template, steps);

        // Three passes over the same deterministic history, one COPY each: a connection runs one COPY at a time,
        // and batch rows must be in before the additions and events that reference them.
        await using (var copy = await BeginAsync(connection, "batches (id, station_id, status, recipe_revision_id, setup, plan, abort_reason, created_at, updated_at, version, last_event_seq, plan_revision, high_water_at)"))
        {
            // Batches come in event order, so the high water is the running maximum of their times (migration 0007).
            var highWaterAt = "";
            foreach (var batch in groups().SelectMany(g => g))
            {
                highWaterAt = string.CompareOrdinal(batch.UpdatedAt, highWaterAt) > 0 ? batch.UpdatedAt : highWaterAt;
                await copy.StartRowAsync();
                await WriteTextsAsync(copy, batch.Id, batch.StationId, batch.Status.ToString());
                await copy.WriteAsync(template.RecipeRevisionId, NpgsqlDbType.Bigint);
                await WriteTextsAsync(copy, batch.Setup, template.Plan, batch.Status == BatchStatus.Aborted ? "sol gelled in the vessel" : "", TimeText.Format(batch.CreatedAt), batch.UpdatedAt);
                await copy.WriteAsync((long)SeededBatch.EventsPerBatch, NpgsqlDbType.Bigint);
                await copy.WriteAsync(batch.LastEventSeq, NpgsqlDbType.Bigint);
                await copy.WriteAsync(0L, NpgsqlDbType.Bigint);
                await copy.WriteAsync(highWaterAt, NpgsqlDbType.Text);
            }

            await copy.CompleteAsync();
        }

        await using (var copy = await BeginAsync(connection, "additions (batch_id, addition_id, ordinal, step_index, reading_g, stable, source, lot_id, true_mass_g, within_window, recorded_at, content_hash, response, plan_revision, target_mass_g, acceptance_g)"))
        {
            foreach (var a in groups().SelectMany(g => g).SelectMany(b => b.Additions))
            {
                await copy.StartRowAsync();
                await WriteTextsAsync(copy, a.BatchId, a.AdditionId);
                await copy.WriteAsync((int)a.Ordinal, NpgsqlDbType.Integer);
                await copy.WriteAsync((int)a.StepIndex, NpgsqlDbType.Integer);
                await copy.WriteAsync(a.ReadingG, NpgsqlDbType.Double);
                await copy.WriteAsync(a.Stable, NpgsqlDbType.Boolean);
                await WriteTextsAsync(copy, a.Source, a.LotId);
                await copy.WriteAsync(a.TrueMassG, NpgsqlDbType.Double);
                await copy.WriteAsync(a.WithinWindow, NpgsqlDbType.Boolean);
                await WriteTextsAsync(copy, a.RecordedAt, a.ContentHash, a.Response);
                await copy.WriteAsync(a.PlanRevision, NpgsqlDbType.Bigint);
                await copy.WriteAsync(a.TargetMassG, NpgsqlDbType.Double);
                await copy.WriteAsync(a.AcceptanceG, NpgsqlDbType.Double);
            }

            await copy.CompleteAsync();
        }

        await using (var copy = await BeginAsync(connection, "batch_events (seq, batch_id, type, body, occurred_at, actor_key_id, station_id, addition_id, prev_hash, hash)"))
        {
            foreach (var group in groups())
            {
                var prevHash = new string[group.Length];
                for (var k = 0; k < SeededBatch.EventsPerBatch; k++)
                {
                    for (var j = 0; j < group.Length; j++)
                    {
                        var (e, addition) = group[j].Event(k);
                        var hash = AuditChain.Link(prevHash[j] ?? "", AuditChain.Canonical(e, addition));
                        await copy.StartRowAsync();
                        await copy.WriteAsync(e.Seq, NpgsqlDbType.Bigint);
                        await WriteTextsAsync(copy, e.BatchId, e.Type, e.Body, e.OccurredAt, e.ActorKeyId, e.StationId, e.AdditionId, prevHash[j] ?? "", hash);
                        prevHash[j] = hash;
                    }
                }
            }

            await copy.CompleteAsync();
        }

        var all = groups().SelectMany(g => g).ToArray();
        await using var finish = new NpgsqlBatch(connection)
        {
            BatchCommands =
            {
                new("DELETE FROM batch_events WHERE batch_id = $1") { Parameters = { new() { Value = templateId } } },
                new("DELETE FROM batches WHERE id = $1") { Parameters = { new() { Value = templateId } } },
                new("UPDATE event_sequence SET last_seq = $1, high_water_at = $2") { Parameters = { new() { Value = all[^1].LastEventSeq }, new() { Value = all.Select(b => b.UpdatedAt).Max(StringComparer.Ordinal)! } } },
            },
        };
        await finish.ExecuteNonQueryAsync();
        await new NpgsqlCommand("VACUUM (ANALYZE)", connection).ExecuteNonQueryAsync();
        // Written out now, not by the checkpointer and the backends while the first pages are timed.
        await new NpgsqlCommand("CHECKPOINT", connection).ExecuteNonQueryAsync();
        return new SeededHistory([.. all.Select(b => (b.LastEventSeq, b.UpdatedAt)).OrderBy(b => b.LastEventSeq)]);
    }

    /// <summary>The history as groups of batches made side by side; enumerating it again gives the same batches.</summary>
    private static Func<IEnumerable<SeededBatch[]>> Groups(int batches, SeedTemplate template, IReadOnlyList<PlanStep> steps) => () =>
        Enumerable.Range(0, (batches + Concurrent - 1) / Concurrent).Select(g =>
        {
            var size = Math.Min(Concurrent, batches - (g * Concurrent));
            // Sequence 1 was the template's creation; the history starts after it.
            var firstSeq = 2 + ((long)g * Concurrent * SeededBatch.EventsPerBatch);
            return Enumerable.Range(0, size)
                .Select(j => new SeededBatch((g * Concurrent) + j, template, steps, HistoryStart + (GroupSpacing * g), firstSeq, size, j)).ToArray();
        });

    private static async Task<SeedTemplate> TemplateAsync(NpgsqlConnection connection, string templateId)
    {
        await using var command = new NpgsqlCommand("SELECT recipe_revision_id, setup, plan, station_id FROM batches WHERE id = $1", connection) { Parameters = { new() { Value = templateId } } };
        await using var reader = await command.ExecuteReaderAsync();
        return await reader.ReadAsync()
            ? new SeedTemplate(reader.GetInt64(0), reader.GetString(1), reader.GetString(2), reader.GetString(3))
            : throw new InvalidOperationException($"template batch {templateId} is not stored");
    }

    private static Task<NpgsqlBinaryImporter> BeginAsync(NpgsqlConnection connection, string tableAndColumns) =>
        connection.BeginBinaryImportAsync($"COPY {tableAndColumns} FROM STDIN (FORMAT BINARY)");

    private static async Task WriteTextsAsync(NpgsqlBinaryImporter copy, params string[] texts)
    {
        foreach (var text in texts)
        {
            await copy.WriteAsync(text, NpgsqlDbType.Text);
        }
    }
}
