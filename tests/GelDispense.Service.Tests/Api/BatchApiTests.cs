using System.Text.Json.Nodes;
using GelDispense.Contracts.V1;
using GelDispense.Service.Tests.Infrastructure;
using Grpc.Core;

namespace GelDispense.Service.Tests.Api;

[Collection(ApiCollection.Name)]
public sealed class BatchApiTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task Weighing_every_step_at_its_target_reading_gives_the_planned_R_as_made(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var batch = await Demo.StartBatchAsync(client);
        var id = (string)batch["id"]!;
        JsonNode? last = null;
        foreach (var step in batch["steps"]!.AsArray())
        {
            var index = (int)step!["index"]!;
            last = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition($"a{index}", index, (double)step["targetReadingG"]!));
            // A reading equal to the target reading is the target true mass once buoyancy is undone.
            Assert.Equal((double)step["targetMassG"]!, (double)last["addition"]!["trueMassG"]!, 9);
            Assert.True((bool)last["addition"]!["withinWindow"]!);
        }

        Assert.Equal(4.0, (double)last!["asMade"]!["composition"]!["hydrolysisRatio"]!, 6);
        var asMade = await Demo.GetAsync(client, $"/v1/batches/{id}/as-made");
        Assert.True((bool)asMade["withinSpec"]!);
        Assert.Equal(3, (int)asMade["stepsDone"]!);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_water_reading_is_corrected_for_air_buoyancy_by_the_published_factor(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var batch = await Demo.StartBatchAsync(client);
        var waterStep = batch["steps"]!.AsArray().Single(s => (string)s!["reagentId"]! == "water")!;

        var result = await Demo.PostAsync(client, $"/v1/batches/{batch["id"]}/additions", Demo.Addition("w1", (int)waterStep["index"]!, 10.0));

        // m/W = 1.001053 for water at air density 1.2 kg/m³ against 8000 kg/m³ weights (NIST SOP 2 / EURAMET cg-18 form,
        // published-values §4, status C); the default air here is CIPM-2007 at 20 °C, 50 % RH, about 1.1993 kg/m³.
        Assert.Equal(10.01053, (double)result["addition"]!["trueMassG"]!, 4);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Replaying_an_addition_id_returns_the_first_result_and_other_content_is_a_409(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var id = (string)(await Demo.StartBatchAsync(client))["id"]!;
        var first = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("x1", 0, 20.81));

        var replay = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("x1", 0, 20.81));
        var conflict = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("x1", 0, 20.95), 409);

        Assert.True((bool)replay["replayed"]!);
        Assert.Equal((string)first["addition"]!["recordedAt"]!, (string)replay["addition"]!["recordedAt"]!);
        Assert.Equal("additionId", (string)conflict["errors"]![0]!["field"]!);
        var stored = await Demo.GetAsync(client, $"/v1/batches/{id}");
        Assert.Single(stored["additions"]!.AsArray());
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Unstable_negative_and_unknown_step_readings_are_refused_with_their_reason(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var id = (string)(await Demo.StartBatchAsync(client))["id"]!;

        var unstable = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("u1", 0, 20.8, stable: false), 400);
        var negative = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("n1", 0, -0.5), 400);
        var unknown = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("s1", 9, 1.0), 400);

        Assert.Equal("stable", (string)unstable["errors"]![0]!["field"]!);
        Assert.Equal("readingG", (string)negative["errors"]![0]!["field"]!);
        Assert.Equal("-0.5", (string)negative["errors"]![0]!["value"]!);
        Assert.Equal("stepIndex", (string)unknown["errors"]![0]!["field"]!);
        Assert.Contains("no such step", (string)unknown["errors"]![0]!["reason"]!, StringComparison.Ordinal);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_completed_batch_refuses_additions_with_409_and_unknown_batches_are_404(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var id = (string)(await Demo.StartBatchAsync(client))["id"]!;

        var completed = await Demo.PostAsync(client, $"/v1/batches/{id}:complete", "{}");
        await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("late", 0, 20.8), 409);
        await Demo.PostAsync(client, $"/v1/batches/{id}:abort", """{"reason":"spilled"}""", 409);
        await Demo.GetAsync(client, "/v1/batches/b-does-not-exist", 404);

        Assert.Equal("BATCH_STATUS_COMPLETED", (string)completed["status"]!);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task The_LIMS_list_pages_by_change_and_a_changed_batch_comes_again_after_the_cursor(string engine)
    {
        var host = await hosts.ServiceHostOnNewDatabaseAsync(engine);
        await using var _ = host;
        var client = host.CreateClient();
        var ids = new List<string>();
        for (var i = 0; i < 5; i++)
        {
            ids.Add((string)(await Demo.StartBatchAsync(client, "lims-station"))["id"]!);
        }

        var first = await Demo.GetAsync(client, "/v1/batches?pageSize=2");
        var second = await Demo.GetAsync(client, $"/v1/batches?pageSize=2&pageToken={first["nextPageToken"]}");
        var third = await Demo.GetAsync(client, $"/v1/batches?pageSize=2&pageToken={second["nextPageToken"]}");
        Assert.Equal(ids, new[] { first, second, third }.SelectMany(p => p["batches"]!.AsArray()).Select(b => (string)b!["id"]!));
        Assert.False((bool)third["hasMore"]!);

        await Demo.PostAsync(client, $"/v1/batches/{ids[0]}/additions", Demo.Addition("l1", 0, 20.8));
        var later = await Demo.GetAsync(client, $"/v1/batches?pageSize=2&pageToken={third["nextPageToken"]}");
        Assert.Equal([ids[0]], later["batches"]!.AsArray().Select(b => (string)b!["id"]!));
        await Demo.GetAsync(client, "/v1/batches?pageToken=not-a-token", 400);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task The_CSV_export_has_units_in_the_header_and_one_row_per_addition(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var id = (string)(await Demo.StartBatchAsync(client))["id"]!;
        await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("c1", 0, 20.81));
        await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("c2", 1, 18.4));

        using var response = await client.GetAsync($"/v1/batches:export-csv?batchId={id}");
        var lines = (await response.Content.ReadAsStringAsync()).Split("\r\n", StringSplitOptions.RemoveEmptyEntries);

        Assert.Equal("text/csv", response.Content.Headers.ContentType!.MediaType);
        Assert.Contains("reading_g", lines[0], StringComparison.Ordinal);
        Assert.Contains("true_mass_g", lines[0], StringComparison.Ordinal);
        Assert.Equal(3, lines.Length);
        Assert.StartsWith($"{id},bench-2,", lines[1], StringComparison.Ordinal);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Watching_a_batch_over_gRPC_streams_its_events_until_it_completes(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var id = (string)(await Demo.StartBatchAsync(client))["id"]!;
        var batches = new BatchService.BatchServiceClient(host.Channel());
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        using var call = batches.WatchBatch(new WatchBatchRequest { BatchId = id }, cancellationToken: timeout.Token);

        await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("w1", 0, 20.8));
        await Demo.PostAsync(client, $"/v1/batches/{id}:complete", "{}");
        var events = new List<BatchEvent>();
        await foreach (var batchEvent in call.ResponseStream.ReadAllAsync(timeout.Token))
        {
            events.Add(batchEvent);
        }

        Assert.Equal([BatchEventType.Created, BatchEventType.AdditionRecorded, BatchEventType.Completed], events.Select(e => e.Type));
        Assert.True(events.Zip(events.Skip(1)).All(p => p.First.Sequence < p.Second.Sequence));
        Assert.Equal("w1", events[1].Addition.AdditionId);
    }
}
