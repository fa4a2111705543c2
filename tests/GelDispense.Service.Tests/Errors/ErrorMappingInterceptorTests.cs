using GelDispense.Service.Tests.Infrastructure;
using Microsoft.Data.Sqlite;

namespace GelDispense.Service.Tests.Errors;

[Collection(ApiCollection.Name)]
public sealed class ErrorMappingInterceptorTests(ApiHosts hosts)
{
    [Theory, PostgresEngine]
    public async Task A_database_connection_cut_under_an_addition_answers_503_and_the_retry_records_it_once(string engine)
    {
        await using var host = await hosts.ServiceHostOnNewDatabaseAsync(engine);
        var client = host.CreateClient();
        var batch = await Demo.StartBatchAsync(client);
        var id = (string)batch["id"]!;
        var addition = Demo.Addition("cut-1", 0, (double)batch["steps"]![0]!["targetReadingG"]!);

        // As a database restart or a failover does: every backend serving the service is ended under its pool.
        Assert.True(await RawDatabase.EndServiceBackendsAsync(host) > 0);
        var refused = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", addition, 503);
        var recorded = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", addition);

        Assert.Equal("urn:geldispense:problem:unavailable", (string)refused["type"]!);
        Assert.Equal("cut-1", (string)recorded["addition"]!["additionId"]!);
        var stored = await Demo.GetAsync(client, $"/v1/batches/{id}");
        Assert.Equal(["cut-1"], stored["additions"]!.AsArray().Select(a => (string)a!["additionId"]!));
    }

    [Fact]
    public async Task A_SQLite_file_locked_by_another_process_past_the_timeout_answers_503_and_the_retry_records_it_once()
    {
        // A one-second wait for the lock instead of the default 30 s.
        await using var host = new ServiceHost("Sqlite", await hosts.NewDatabaseAsync("Sqlite") + ";Default Timeout=1");
        var client = host.CreateClient();
        var batch = await Demo.StartBatchAsync(client);
        var id = (string)batch["id"]!;
        var addition = Demo.Addition("locked-1", 0, (double)batch["steps"]![0]!["targetReadingG"]!);

        // As a backup or a second program writing the file would: its write lock held past the service's timeout.
        await using (var other = new SqliteConnection(new SqliteConnectionStringBuilder(host.ConnectionString) { Pooling = false }.ConnectionString))
        {
            await other.OpenAsync();
            await using var hold = other.CreateCommand();
            hold.CommandText = "BEGIN EXCLUSIVE";
            await hold.ExecuteNonQueryAsync();
            var refused = await Demo.PostAsync(client, $"/v1/batches/{id}/additions", addition, 503);
            Assert.Equal("urn:geldispense:problem:unavailable", (string)refused["type"]!);
        }

        await Demo.PostAsync(client, $"/v1/batches/{id}/additions", addition);
        var stored = await Demo.GetAsync(client, $"/v1/batches/{id}");
        Assert.Equal(["locked-1"], stored["additions"]!.AsArray().Select(a => (string)a!["additionId"]!));
    }
}
