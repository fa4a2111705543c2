using System.Net;
using System.Net.Http.Headers;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Npgsql;

namespace GelDispense.Service.Tests.Storage;

/// <summary>
/// A REST call that times out takes its database work with it: the query is cancelled on the server, not left
/// waiting with a pooled connection after the caller has had its 504, and its transaction leaves nothing behind.
/// </summary>
[Collection(ApiCollection.Name)]
public sealed class QueryCancellationTests(ApiHosts hosts)
{
    [Theory, PostgresEngine]
    public async Task A_write_stuck_behind_a_row_lock_is_cancelled_when_the_REST_call_times_out_and_writes_nothing(string engine)
    {
        var database = await hosts.NewDatabaseAsync(engine);
        await using var host = await KestrelHost.StartAsync(new Dictionary<string, string>
        {
            ["Storage:Provider"] = engine,
            ["ConnectionStrings:GelDispense"] = database,
            ["Limits:RestRequestTimeoutSeconds"] = "1",
        });
        using var rest = new HttpClient { BaseAddress = new Uri($"http://127.0.0.1:{host.RestPort}"), Timeout = TimeSpan.FromSeconds(30) };
        rest.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", await host.IssueKeyAsync(Roles.Admin));
        var id = (string)(await Demo.StartBatchAsync(rest, stationId: "bench-lock"))["id"]!;

        // Someone with database access holds the batch row, so the service's write must wait for the lock.
        await using var holder = new NpgsqlConnection(database);
        await holder.OpenAsync();
        await using var hold = await holder.BeginTransactionAsync();
        await using (var lockRow = new NpgsqlCommand("SELECT 1 FROM batches WHERE id = @id FOR UPDATE", holder, hold))
        {
            lockRow.Parameters.AddWithValue("id", id);
            await lockRow.ExecuteScalarAsync();
        }

        using var timedOut = await rest.PostAsync($"/v1/batches/{id}/additions", Demo.Json(Demo.Addition("lk1", 0, 20.8)));
        var stillWaiting = await WaitingOnLocksAsync(database, until: 0, TimeSpan.FromSeconds(10));
        await hold.RollbackAsync();
        var after = await Demo.GetAsync(rest, $"/v1/batches/{id}");
        var again = await Demo.PostAsync(rest, $"/v1/batches/{id}/additions", Demo.Addition("lk1", 0, 20.8));

        Assert.Equal(HttpStatusCode.GatewayTimeout, timedOut.StatusCode);
        Assert.Equal(0, stillWaiting);
        Assert.Empty(after["additions"]?.AsArray() ?? []);
        Assert.False((bool?)again["replayed"] ?? false);
    }

    /// <summary>Backends of the database waiting on a lock, polled until there are <paramref name="until"/> or the time is up.</summary>
    private static async Task<long> WaitingOnLocksAsync(string database, long until, TimeSpan within)
    {
        await using var connection = new NpgsqlConnection(database);
        await connection.OpenAsync();
        await using var count = new NpgsqlCommand(
            "SELECT COUNT(*) FROM pg_stat_activity WHERE datname = current_database() AND wait_event_type = 'Lock'", connection);
        var deadline = DateTime.UtcNow + within;
        long waiting;
        while ((waiting = (long)(await count.ExecuteScalarAsync())!) != until && DateTime.UtcNow < deadline)
        {
            await Task.Delay(100);
        }

        return waiting;
    }
}
