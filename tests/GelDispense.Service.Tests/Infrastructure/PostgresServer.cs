using DotNet.Testcontainers.Configurations;
using Npgsql;
using Testcontainers.PostgreSql;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>
/// Where the PostgreSQL runs of the API suite get their server: GELDISPENSE_TEST_POSTGRES if set, else a
/// Testcontainers container when a Docker engine answers, else a local throwaway cluster when binaries are
/// installed, else nothing (the PostgreSQL rows are skipped, with the reason in <see cref="UnavailableReason"/>).
/// </summary>
public sealed class PostgresServer : IAsyncDisposable
{
    public const string EnvironmentVariable = "GELDISPENSE_TEST_POSTGRES";

    private readonly IAsyncDisposable? _owned;

    private PostgresServer(string connectionString, IAsyncDisposable? owned)
    {
        ConnectionString = connectionString;
        _owned = owned;
    }

    public string ConnectionString { get; }

    /// <summary>Null when some server can be had; otherwise why not. Cheap: looks at the environment and the file system only.</summary>
    public static string? UnavailableReason =>
        Environment.GetEnvironmentVariable(EnvironmentVariable) is { Length: > 0 } || File.Exists("/var/run/docker.sock") || LocalPostgres.FindBinaries() is not null
            ? null
            : $"PostgreSQL suite skipped: set {EnvironmentVariable}, run a Docker engine, or install PostgreSQL (apt-get install postgresql).";

    public static async Task<PostgresServer> StartAsync()
    {
        if (Environment.GetEnvironmentVariable(EnvironmentVariable) is { Length: > 0 } given)
        {
            return new PostgresServer(given, null);
        }

        if (TestcontainersSettings.OS.DockerEndpointAuthConfig is not null)
        {
            var container = new PostgreSqlBuilder("postgres:16-alpine").Build();
            await container.StartAsync();
            return new PostgresServer(container.GetConnectionString(), container);
        }

        var local = await LocalPostgres.StartAsync();
        return new PostgresServer(local.ConnectionString, local);
    }

    /// <summary>A fresh, empty database on the server, so each host starts from nothing.</summary>
    public async Task<string> CreateDatabaseAsync(string name)
    {
        await using var connection = new NpgsqlConnection(ConnectionString);
        await connection.OpenAsync();
        await using var command = new NpgsqlCommand($"CREATE DATABASE \"{name}\"", connection);
        await command.ExecuteNonQueryAsync();
        return new NpgsqlConnectionStringBuilder(ConnectionString) { Database = name }.ConnectionString;
    }

    public async ValueTask DisposeAsync()
    {
        if (_owned is not null)
        {
            await _owned.DisposeAsync();
        }
    }
}
