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
}
