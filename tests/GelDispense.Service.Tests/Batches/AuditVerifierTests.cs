using System.Text.Json.Nodes;
using Dapper;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Microsoft.Extensions.DependencyInjection;

namespace GelDispense.Service.Tests.Batches;

/// <summary>
/// The audit trail end to end: events written through the API by a station key, checked through the REST route by a
/// lims key, and tampered with through a raw connection of our own (not the service's) as an intruder with database
/// access would.
/// </summary>
[Collection(ApiCollection.Name)]
public sealed class AuditVerifierTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_clean_batch_verifies_and_each_event_records_the_callers_key_id_and_station(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var (stationKeyId, id) = await RunBatchAsync(host, "bench-audit-1");

        var verdict = await Demo.GetAsync(host.ClientWith(await host.IssueKeyAsync(Roles.Lims)), $"/v1/batches/{id}/audit:verify");
        Assert.True((bool)verdict["ok"]!, verdict.ToJsonString());
        Assert.Equal(4, (int)verdict["eventsChecked"]!);
        Assert.Equal("", (string)verdict["reason"]!);

        await using var connection = await RawDatabase.OpenAsync(host);
        var events = (await connection.QueryAsync<(string Actor, string Station, string Type)>(
            "SELECT actor_key_id, station_id, type FROM batch_events WHERE batch_id = @id ORDER BY seq", new { id })).ToList();
        Assert.Equal(["Created", "ADDITION_RECORDED", "ADDITION_RECORDED", "Completed"], events.Select(e => e.Type));
        Assert.All(events, e => Assert.Equal((stationKeyId, "bench-audit-1"), (e.Actor, e.Station)));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task An_addition_reading_changed_in_the_database_breaks_the_chain_at_its_event(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var (_, id) = await RunBatchAsync(host, "bench-audit-2");
        await using (var connection = await RawDatabase.OpenAsync(host))
        {
            var changed = await connection.ExecuteAsync(
                "UPDATE additions SET reading_g = reading_g + 0.001 WHERE batch_id = @id AND addition_id = 'audit-a1'", new { id });
            Assert.Equal(1, changed);
        }

        var verdict = await VerifyAsync(host, id);
        Assert.False((bool)verdict["ok"]!);
        Assert.Equal(1, (int)verdict["firstBrokenIndex"]!);
        Assert.Equal(2, (int)verdict["eventsChecked"]!);
        Assert.Equal(await SeqAsync(host, id, 1), (long)verdict["firstBrokenSequence"]!);
        Assert.Contains("audit-a1", (string)verdict["reason"]!, StringComparison.Ordinal);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task An_event_payload_changed_in_the_database_is_named_as_the_first_broken_link(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var (_, id) = await RunBatchAsync(host, "bench-audit-3");
        var secondAddition = await SeqAsync(host, id, 2);
        await using (var connection = await RawDatabase.OpenAsync(host))
        {
            var changed = await connection.ExecuteAsync(
                "UPDATE batch_events SET body = REPLACE(body, 'audit-a2', 'audit-x2') WHERE seq = @secondAddition", new { secondAddition });
            Assert.Equal(1, changed);
        }

        var verdict = await VerifyAsync(host, id);
        Assert.False((bool)verdict["ok"]!);
        Assert.Equal(2, (int)verdict["firstBrokenIndex"]!);
        Assert.Equal(secondAddition, (long)verdict["firstBrokenSequence"]!);
        Assert.Contains("no longer matches", (string)verdict["reason"]!, StringComparison.Ordinal);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Corrections_join_the_chain_and_a_correction_row_changed_in_the_database_breaks_it_at_that_correction(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var (_, id) = await RunBatchAsync(host, "bench-audit-5");
        var admin = host.CreateClient();
        await Demo.PostAsync(admin, Corrections.Path(id, "audit-a1"), Corrections.Body("audit-c1", 20.5, "printout shows 20.5 g"));
        await Demo.PostAsync(admin, Corrections.Path(id, "audit-a2"), Corrections.Body("audit-c2", 30.25, "printout shows 30.25 g"));
        var clean = await VerifyAsync(host, id);
        Assert.True((bool)clean["ok"]!, clean.ToJsonString());
        Assert.Equal(6, (int)clean["eventsChecked"]!);

        await using (var connection = await RawDatabase.OpenAsync(host))
        {
            var changed = await connection.ExecuteAsync(
                "UPDATE addition_corrections SET reading_g = 20.55 WHERE batch_id = @id AND correction_id = 'audit-c1'", new { id });
            Assert.Equal(1, changed);
        }

        // Events: created, two additions, completed, then the two corrections; the first correction is the broken link.
        var verdict = await VerifyAsync(host, id);
        Assert.False((bool)verdict["ok"]!);
        Assert.Equal(4, (int)verdict["firstBrokenIndex"]!);
        Assert.Equal(5, (int)verdict["eventsChecked"]!);
        Assert.Equal(await SeqAsync(host, id, 4), (long)verdict["firstBrokenSequence"]!);
        Assert.Contains("audit-c1", (string)verdict["reason"]!, StringComparison.Ordinal);
    }

    [Theory, SqliteEngine]
    public async Task A_station_key_may_not_verify_and_a_formulator_key_neither(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var (_, id) = await RunBatchAsync(host, "bench-audit-4");
        await Demo.GetAsync(host.ClientWith(await host.IssueKeyAsync(Roles.Station, "bench-audit-4")), $"/v1/batches/{id}/audit:verify", 403);
        await Demo.GetAsync(host.ClientWith(await host.IssueKeyAsync(Roles.Formulator)), $"/v1/batches/{id}/audit:verify", 403);
    }

    /// <summary>A station key starts a batch, records two additions at the first two steps' targets and completes it.</summary>
    private static async Task<(string KeyId, string BatchId)> RunBatchAsync(ServiceHost host, string stationId)
    {
        var (row, key) = await host.Services.GetRequiredService<ApiKeyIssuer>().IssueAsync(Roles.Station, stationId, null, "audit test", CancellationToken.None);
        var station = host.ClientWith(key);
        var batch = await Demo.StartBatchAsync(station, stationId);
        var id = (string)batch["id"]!;
        for (var i = 0; i < 2; i++)
        {
            var step = batch["steps"]![i]!;
            await Demo.PostAsync(station, $"/v1/batches/{id}/additions", Demo.Addition($"audit-a{i + 1}", (int)step["index"]!, (double)step["targetReadingG"]!));
        }

        await Demo.PostAsync(station, $"/v1/batches/{id}:complete", "{}");
        return (row.Id, id);
    }

    private static async Task<JsonNode> VerifyAsync(ServiceHost host, string id) =>
        await Demo.GetAsync(host.ClientWith(await host.IssueKeyAsync(Roles.Lims)), $"/v1/batches/{id}/audit:verify");

    private static async Task<long> SeqAsync(ServiceHost host, string id, int index)
    {
        await using var connection = await RawDatabase.OpenAsync(host);
        return (await connection.QueryAsync<long>("SELECT seq FROM batch_events WHERE batch_id = @id ORDER BY seq", new { id })).ElementAt(index);
    }
}
