using Dapper;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using GelDispense.Service.Storage;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Time.Testing;

namespace GelDispense.Service.Tests.Batches;

/// <summary>
/// Corrections of recorded additions through the real service on both engines: what the correction event records,
/// that the addition row stays as it was, how the as-made record and the re-plan follow the corrected reading, and
/// that replays and concurrent writers behave as they do for additions.
/// </summary>
[Collection(ApiCollection.Name)]
public sealed class AdditionCorrectorTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_correction_is_a_new_event_that_references_the_corrected_event_and_records_key_station_and_clock_time(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var clock = new FakeTimeProvider(new DateTimeOffset(2031, 3, 4, 5, 6, 7, TimeSpan.Zero));
        await using var factory = host.WithWebHostBuilder(b => b.ConfigureTestServices(s => s.AddSingleton<TimeProvider>(clock)));
        var (key, keyId) = await StationKeyAsync(factory, "bench-corr-1");
        var grpc = Corrections.Client(factory, key);
        var batch = await grpc.CreateBatchAsync(Corrections.CreateRequest("bench-corr-1"));
        var first = await grpc.RecordAdditionAsync(Corrections.Add(batch, "a1", 0, batch.Steps[0].TargetReadingG));
        await grpc.RecordAdditionAsync(Corrections.Add(batch, "a2", 1, batch.Steps[1].TargetReadingG));

        clock.Advance(TimeSpan.FromMinutes(12));
        var corrected = await grpc.CorrectAdditionAsync(Corrections.Correct(batch, "a1", "c1", first.Addition.ReadingG + 0.04, "balance read before it settled"));

        await using var connection = await RawDatabase.OpenAsync(host);
        var events = (await connection.QueryAsync<(long Seq, string Type, string Actor, string Station, string At, string Addition, string Correction)>(
            "SELECT seq, type, actor_key_id, station_id, occurred_at, addition_id, correction_id FROM batch_events WHERE batch_id = @id ORDER BY seq",
            new { id = batch.Id })).ToList();
        Assert.Equal(["Created", "ADDITION_RECORDED", "ADDITION_RECORDED", "ADDITION_CORRECTED"], events.Select(e => e.Type));
        var c1 = corrected.Correction;
        Assert.Equal(events[3].Seq, c1.Sequence);
        Assert.Equal(events.Single(e => e.Addition == "a1").Seq, c1.CorrectsSequence);
        Assert.Equal((keyId, "bench-corr-1", "c1"), (c1.ActorKeyId, c1.StationId, c1.CorrectionId));
        Assert.Equal(clock.GetUtcNow(), c1.CorrectedAt.ToDateTimeOffset());
        Assert.Equal((keyId, "bench-corr-1", TimeText.Format(clock.GetUtcNow()), "c1"), (events[3].Actor, events[3].Station, events[3].At, events[3].Correction));
        Assert.Equal(first.Addition.ReadingG, c1.PreviousReadingG);

        clock.Advance(TimeSpan.FromMinutes(1));
        var again = await grpc.CorrectAdditionAsync(Corrections.Correct(batch, "a1", "c2", first.Addition.ReadingG + 0.03, "second look at the printout"));
        Assert.Equal(c1.Sequence, again.Correction.CorrectsSequence);
        Assert.Equal(c1.ReadingG, again.Correction.PreviousReadingG);
        Assert.Equal((2, first.Addition.ReadingG, first.Addition.ReadingG + 0.03), (again.Addition.CorrectionCount, again.Addition.OriginalReadingG, again.Addition.ReadingG));

        // The addition row is never rewritten: reading, true mass and window flag are what the first post stored.
        var row = await connection.QuerySingleAsync<(double ReadingG, double TrueMassG, string RecordedAt)>(
            "SELECT reading_g, true_mass_g, recorded_at FROM additions WHERE batch_id = @id AND addition_id = 'a1'", new { id = batch.Id });
        Assert.Equal((first.Addition.ReadingG, first.Addition.TrueMassG), (row.ReadingG, row.TrueMassG));
        Assert.Equal(first.Addition.RecordedAt.ToDateTimeOffset(), TimeText.Parse(row.RecordedAt));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_completed_batch_stays_completed_and_its_as_made_GetBatch_LIMS_page_and_CSV_use_the_corrected_reading(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var station = Corrections.Client(host, await host.IssueKeyAsync(Roles.Station, "bench-corr-2"));
        var batch = await station.CreateBatchAsync(Corrections.CreateRequest("bench-corr-2"));
        foreach (var step in batch.Steps)
        {
            await station.RecordAdditionAsync(Corrections.Add(batch, $"s{step.Index}", step.Index, step.TargetReadingG));
        }

        await station.CompleteBatchAsync(new CompleteBatchRequest { Id = batch.Id });
        var lims = Corrections.Client(host, await host.IssueKeyAsync(Roles.Lims));
        var pulled = await lims.ListBatchesAsync(new ListBatchesRequest { StationId = "bench-corr-2" });
        var before = await lims.GetAsMadeAsync(new GetAsMadeRequest { BatchId = batch.Id });

        // 1.5 % more TEOS than the balance was first said to show: R falls by about as much.
        var teos = batch.Steps.First(s => s.ReagentId == "teos");
        var correctedReadingG = Math.Round(teos.TargetReadingG * 1.015, 3);
        var response = await Demo.PostAsync(host.ClientWith(await host.IssueKeyAsync(Roles.Station, "bench-corr-2")),
            Corrections.Path(batch.Id, $"s{teos.Index}"), Corrections.Body("fix-teos", correctedReadingG, "digits swapped when keyed by hand"));
        Assert.False((bool?)response["replanned"] ?? false);
        Assert.Empty(response["remainingSteps"]!.AsArray());

        var asMade = await lims.GetAsMadeAsync(new GetAsMadeRequest { BatchId = batch.Id });
        var expected = LibraryAsMade.Of(batch, batch.Steps.Select(s => (s.Index, s.Index == teos.Index ? correctedReadingG : s.TargetReadingG)));
        Close(expected.HydrolysisRatio, asMade.Composition.HydrolysisRatio, "hydrolysisRatio");
        Close(expected.PrecursorMol, asMade.Composition.PrecursorMol, "precursorMol");
        Close(expected.WaterMol, asMade.Composition.WaterMol, "waterMol");
        Close(expected.OxideMassG, asMade.Composition.OxideMassG, "oxideMassG");
        Close(expected.GelVolumeMl, asMade.Composition.GelVolumeMl, "gelVolumeMl");
        Assert.True(asMade.Composition.HydrolysisRatio < before.Composition.HydrolysisRatio * 0.99, "the correction did not reach the as-made record");

        var stored = await lims.GetBatchAsync(new GetBatchRequest { Id = batch.Id });
        Assert.Equal(BatchStatus.Completed, stored.Status);
        var addition = stored.Additions.Single(a => a.AdditionId == $"s{teos.Index}");
        Assert.Equal((correctedReadingG, teos.TargetReadingG, 1), (addition.ReadingG, addition.OriginalReadingG, addition.CorrectionCount));
        Assert.Equal(("fix-teos", "digits swapped when keyed by hand"), (addition.LatestCorrection.CorrectionId, addition.LatestCorrection.Reason));

        // The LIMS pull resumed from its last token sees the batch again, with the corrected addition.
        var next = await lims.ListBatchesAsync(new ListBatchesRequest { StationId = "bench-corr-2", PageToken = pulled.NextPageToken });
        Assert.Equal(correctedReadingG, next.Batches.Single(b => b.Id == batch.Id).Additions.Single(a => a.AdditionId == $"s{teos.Index}").ReadingG);

        var csv = (await host.CreateClient().GetStringAsync($"/v1/batches:export-csv?batchId={batch.Id}")).Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
        var header = csv[0].Split(',').ToList();
        Assert.Equal(batch.Steps.Count, csv.Length - 1);
        var cells = csv.Skip(1).Select(l => l.Split(',')).Single(c => c[header.IndexOf("addition_id")] == $"s{teos.Index}");
        Assert.Equal(correctedReadingG, double.Parse(cells[header.IndexOf("reading_g")], System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal(teos.TargetReadingG, double.Parse(cells[header.IndexOf("original_reading_g")], System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal(("1", "fix-teos", "digits swapped when keyed by hand"),
            (cells[header.IndexOf("correction_count")], cells[header.IndexOf("latest_correction_id")], cells[header.IndexOf("correction_reason")]));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task An_in_progress_addition_corrected_out_of_its_window_replans_as_the_same_reading_recorded_directly_would(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var grpc = Corrections.Client(host, host.AdminKey);
        var corrected = await grpc.CreateBatchAsync(Corrections.CreateRequest("bench-corr-3"));
        var direct = await grpc.CreateBatchAsync(Corrections.CreateRequest("bench-corr-3"));
        // TEOS: the precursor moves R, which the spec holds to ± 2 %.
        var teos = corrected.Steps.First(s => s.ReagentId == "teos");
        var targetG = teos.TargetReadingG;
        await grpc.RecordAdditionAsync(Corrections.Add(corrected, "p1", teos.Index, targetG));

        // One readability step off stays in the window: the plan in force stands.
        var small = await grpc.CorrectAdditionAsync(Corrections.Correct(corrected, "p1", "k1", targetG + 0.001, "last digit misread"));
        Assert.Equal((true, false, 0), (small.Correction.WithinWindow, small.Replanned, small.PlanRevision));

        var overPourG = Math.Round(targetG * 1.05, 3);
        var big = await grpc.CorrectAdditionAsync(Corrections.Correct(corrected, "p1", "k2", overPourG, "tared with the funnel still on"));
        var recorded = await grpc.RecordAdditionAsync(Corrections.Add(direct, "p1", teos.Index, overPourG));

        Assert.Equal((false, true, 1), (big.Correction.WithinWindow, big.Replanned, big.PlanRevision));
        Assert.Equal((recorded.Addition.WithinWindow, recorded.Replanned, recorded.PlanRevision), (big.Addition.WithinWindow, big.Replanned, big.PlanRevision));
        Assert.Equal(recorded.RemainingSteps.Select(s => (s.Index, s.TargetMassG)), big.RemainingSteps.Select(s => (s.Index, s.TargetMassG)));
        Assert.Equal(recorded.PredictedFinal.HydrolysisRatio, big.PredictedFinal.HydrolysisRatio, 12);
        var stored = await grpc.GetBatchAsync(new GetBatchRequest { Id = corrected.Id });
        Assert.Equal(1, stored.PlanRevision);
        Assert.Equal(recorded.RemainingSteps.Select(s => s.TargetMassG), stored.Steps.Where(s => s.Index != teos.Index).Select(s => s.TargetMassG));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Replaying_a_correction_id_returns_the_stored_answer_and_other_content_is_a_409_or_ALREADY_EXISTS(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var rest = host.CreateClient();
        var grpc = Corrections.Client(host, host.AdminKey);
        var batch = await grpc.CreateBatchAsync(Corrections.CreateRequest("bench-corr-4"));
        await grpc.RecordAdditionAsync(Corrections.Add(batch, "r1", 0, batch.Steps[0].TargetReadingG));
        var path = Corrections.Path(batch.Id, "r1");
        var body = Corrections.Body("rc1", 20.5, "typed the reading of the previous batch");

        var first = await Demo.PostAsync(rest, path, body);
        var replay = await Demo.PostAsync(rest, path, body);
        Assert.True((bool)replay["replayed"]!);
        Assert.Equal(first["correction"]!.ToJsonString(), replay["correction"]!.ToJsonString());
        var afterFirst = await grpc.GetBatchAsync(new GetBatchRequest { Id = batch.Id });

        var conflict = await Demo.PostAsync(rest, path, Corrections.Body("rc1", 20.6, "typed the reading of the previous batch"), 409);
        Assert.Equal(("correctionId", "rc1"), ((string)conflict["errors"]![0]!["field"]!, (string)conflict["errors"]![0]!["value"]!));
        var refused = await Assert.ThrowsAsync<RpcException>(() => grpc.CorrectAdditionAsync(Corrections.Correct(batch, "r1", "rc1", 20.5, "another reason")).ResponseAsync);
        Assert.Equal(StatusCode.AlreadyExists, refused.StatusCode);

        var after = await grpc.GetBatchAsync(new GetBatchRequest { Id = batch.Id });
        Assert.Equal((afterFirst.Version, afterFirst.LastEventSequence, 1), (after.Version, after.LastEventSequence, after.Additions[0].CorrectionCount));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Concurrent_corrections_and_additions_to_one_batch_are_serialised_into_one_line_of_corrections(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var grpc = Corrections.Client(host, host.AdminKey);
        var batch = await grpc.CreateBatchAsync(Corrections.CreateRequest("bench-corr-5"));
        await grpc.RecordAdditionAsync(Corrections.Add(batch, "z0", 0, batch.Steps[0].TargetReadingG));
        const int corrections = 6;

        // Half the corrections over REST, half over gRPC, racing two additions to other steps.
        var work = Enumerable.Range(0, corrections).Select(async i =>
        {
            var readingG = batch.Steps[0].TargetReadingG + (0.001 * (i + 1));
            if (i % 2 == 0)
            {
                await Demo.PostAsync(host.CreateClient(), Corrections.Path(batch.Id, "z0"), Corrections.Body($"zc{i}", readingG, "recount"));
            }
            else
            {
                await Corrections.Client(host, host.AdminKey).CorrectAdditionAsync(Corrections.Correct(batch, "z0", $"zc{i}", readingG, "recount"));
            }
        }).Append(Task.Run(() => grpc.RecordAdditionAsync(Corrections.Add(batch, "z1", 1, batch.Steps[1].TargetReadingG)).ResponseAsync))
          .Append(Task.Run(() => grpc.RecordAdditionAsync(Corrections.Add(batch, "z2", 2, batch.Steps[2].TargetReadingG)).ResponseAsync));
        await Task.WhenAll(work);

        await using var connection = await RawDatabase.OpenAsync(host);
        var rows = (await connection.QueryAsync<(long Seq, long CorrectsSeq, double ReadingG)>("""
            SELECT e.seq, c.corrects_seq, c.reading_g FROM addition_corrections c
            JOIN batch_events e ON e.batch_id = c.batch_id AND e.correction_id = c.correction_id WHERE c.batch_id = @id ORDER BY e.seq
            """, new { id = batch.Id })).ToList();
        var additionSeq = await connection.QuerySingleAsync<long>("SELECT seq FROM batch_events WHERE batch_id = @id AND addition_id = 'z0'", new { id = batch.Id });
        Assert.Equal(corrections, rows.Count);
        // Each correction supersedes exactly the one before it: no two writers read the same latest event.
        Assert.Equal([additionSeq, .. rows.SkipLast(1).Select(r => r.Seq)], rows.Select(r => r.CorrectsSeq));

        var stored = await grpc.GetBatchAsync(new GetBatchRequest { Id = batch.Id });
        Assert.Equal(3, stored.Additions.Count);
        Assert.Equal((corrections, rows[^1].ReadingG), (stored.Additions[0].CorrectionCount, stored.Additions[0].ReadingG));
        Assert.Equal(1 + 3 + corrections, stored.Version);
        var verdict = await grpc.VerifyBatchAuditAsync(new VerifyBatchAuditRequest { BatchId = batch.Id });
        Assert.True(verdict.Ok, verdict.Reason);
        Assert.Equal(1 + 3 + corrections, verdict.EventsChecked);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Only_the_batchs_own_station_and_admin_may_correct_and_lims_and_formulator_keys_are_refused(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var stationA = Corrections.Client(host, await host.IssueKeyAsync(Roles.Station, "bench-corr-a"));
        var batch = await stationA.CreateBatchAsync(Corrections.CreateRequest("bench-corr-a"));
        await stationA.RecordAdditionAsync(Corrections.Add(batch, "q1", 0, batch.Steps[0].TargetReadingG));
        var path = Corrections.Path(batch.Id, "q1");
        var body = Corrections.Body("qc1", 20.0, "not mine to fix");

        var problem = await Demo.PostAsync(host.ClientWith(await host.IssueKeyAsync(Roles.Station, "bench-corr-b")), path, body, 403);
        Assert.Contains("bench-corr-b", problem.ToJsonString(), StringComparison.Ordinal);
        var stationB = Corrections.Client(host, await host.IssueKeyAsync(Roles.Station, "bench-corr-b"));
        var refused = await Assert.ThrowsAsync<RpcException>(() => stationB.CorrectAdditionAsync(Corrections.Correct(batch, "q1", "qc1", 20.0, "not mine to fix")).ResponseAsync);
        Assert.Equal(StatusCode.PermissionDenied, refused.StatusCode);
        await Demo.PostAsync(host.ClientWith(await host.IssueKeyAsync(Roles.Lims)), path, body, 403);
        await Demo.PostAsync(host.ClientWith(await host.IssueKeyAsync(Roles.Formulator)), path, body, 403);
        Assert.Equal(0, (await stationA.GetBatchAsync(new GetBatchRequest { Id = batch.Id })).Additions[0].CorrectionCount);

        await Demo.PostAsync(host.ClientWith(await host.IssueKeyAsync(Roles.Station, "bench-corr-a")), path, body);
        await Demo.PostAsync(host.CreateClient(), path, Corrections.Body("qc2", 20.1, "admin checked the printout"));
        Assert.Equal(2, (await stationA.GetBatchAsync(new GetBatchRequest { Id = batch.Id })).Additions[0].CorrectionCount);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task An_aborted_batch_refuses_corrections_with_the_reason_and_keeps_its_record(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var grpc = Corrections.Client(host, host.AdminKey);
        var batch = await grpc.CreateBatchAsync(Corrections.CreateRequest("bench-corr-6"));
        await grpc.RecordAdditionAsync(Corrections.Add(batch, "x1", 0, batch.Steps[0].TargetReadingG));
        var aborted = await grpc.AbortBatchAsync(new AbortBatchRequest { Id = batch.Id, Reason = "vessel cracked" });

        var problem = await Demo.PostAsync(host.CreateClient(), Corrections.Path(batch.Id, "x1"), Corrections.Body("xc1", 20.0, "late fix"), 409);
        Assert.Equal(("batchId", batch.Id), ((string)problem["errors"]![0]!["field"]!, (string)problem["errors"]![0]!["value"]!));
        Assert.Contains("aborted", (string)problem["errors"]![0]!["reason"]!, StringComparison.Ordinal);
        var refused = await Assert.ThrowsAsync<RpcException>(() => grpc.CorrectAdditionAsync(Corrections.Correct(batch, "x1", "xc1", 20.0, "late fix")).ResponseAsync);
        Assert.Equal(StatusCode.FailedPrecondition, refused.StatusCode);
        Assert.Equal(aborted.Version, (await grpc.GetBatchAsync(new GetBatchRequest { Id = batch.Id })).Version);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task An_unknown_batch_or_addition_is_404_over_REST_and_NOT_FOUND_over_gRPC_naming_the_field(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var grpc = Corrections.Client(host, host.AdminKey);
        var batch = await grpc.CreateBatchAsync(Corrections.CreateRequest("bench-corr-7"));
        await grpc.RecordAdditionAsync(Corrections.Add(batch, "y1", 0, batch.Steps[0].TargetReadingG));
        var body = Corrections.Body("yc1", 20.0, "check");

        var noBatch = await Demo.PostAsync(host.CreateClient(), Corrections.Path("b-no-such-batch", "y1"), body, 404);
        var noAddition = await Demo.PostAsync(host.CreateClient(), Corrections.Path(batch.Id, "y9"), body, 404);
        Assert.Equal(("batchId", "b-no-such-batch"), ((string)noBatch["errors"]![0]!["field"]!, (string)noBatch["errors"]![0]!["value"]!));
        Assert.Equal(("additionId", "y9"), ((string)noAddition["errors"]![0]!["field"]!, (string)noAddition["errors"]![0]!["value"]!));
        var refused = await Assert.ThrowsAsync<RpcException>(() => grpc.CorrectAdditionAsync(Corrections.Correct(batch, "y9", "yc1", 20.0, "check")).ResponseAsync);
        Assert.Equal(StatusCode.NotFound, refused.StatusCode);
    }

    private static async Task<(string Key, string KeyId)> StationKeyAsync(WebApplicationFactory<Program> factory, string stationId)
    {
        var (row, key) = await factory.Services.GetRequiredService<ApiKeyIssuer>().IssueAsync(Roles.Station, stationId, null, "correction test", CancellationToken.None);
        return (key, row.Id);
    }

    private static void Close(double expected, double actual, string quantity) =>
        Assert.True(Math.Abs(expected - actual) <= 1e-9 * Math.Max(1, Math.Abs(expected)), $"{quantity}: the service says {actual:R}, the chemistry library {expected:R}");
}
