using System.Data.Common;
using Microsoft.Data.Sqlite;
using Npgsql;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>A connection to a host's database that is not the service's own, as someone with database access would open.</summary>
public static class RawDatabase
{
    public static async Task<DbConnection> OpenAsync(ServiceHost host)
    {
        DbConnection connection = host.Engine == "Sqlite" ? new SqliteConnection(host.ConnectionString) : new NpgsqlConnection(host.ConnectionString);
        await connection.OpenAsync();
        return connection;
    }

    /// <summary>
    /// Ends every backend serving the host's PostgreSQL database but this call's own, as a restart or a failover does
    /// under the service's pool; returns how many. Ended in the select list, so only the rows the WHERE keeps are
    /// ended (an AND in the WHERE has no order of evaluation).
    /// </summary>
    public static async Task<int> EndServiceBackendsAsync(ServiceHost host)
    {
        await using var admin = new NpgsqlConnection(new NpgsqlConnectionStringBuilder(host.ConnectionString) { Pooling = false }.ConnectionString);
        await admin.OpenAsync();
        await using var terminate = new NpgsqlCommand(
            "SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE datname = current_database() AND pid <> pg_backend_pid() AND backend_type = 'client backend'", admin);
        await using var ended = await terminate.ExecuteReaderAsync();
        var count = 0;
        while (await ended.ReadAsync())
        {
            count += ended.GetBoolean(0) ? 1 : 0;
        }

        return count;
    }
}
