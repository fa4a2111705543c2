namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>
/// One host per engine, shared by the API suite (start-up and PostgreSQL initdb are paid once). Each engine gets
/// its own fresh database; <see cref="NewDatabaseAsync"/> makes another for tests that need an empty one or a restart.
/// </summary>
public sealed class ApiHosts : IAsyncLifetime
{
    private readonly string _sqliteDir = Path.Combine(Path.GetTempPath(), $"geldispense-tests-{Guid.NewGuid():N}");
    private readonly Dictionary<string, ServiceHost> _shared = [];
    private readonly SemaphoreSlim _gate = new(1, 1);
    private PostgresServer? _postgres;
    private int _databases;

    public Task InitializeAsync()
    {
        Directory.CreateDirectory(_sqliteDir);
        return Task.CompletedTask;
    }

    /// <summary>The shared host of an engine ("Sqlite" or "Postgres").</summary>
    public async Task<ServiceHost> ForAsync(string engine)
    {
        await _gate.WaitAsync();
        try
        {
            if (!_shared.TryGetValue(engine, out var host))
            {
                host = new ServiceHost(engine, await DatabaseAsync(engine, "shared"));
                _shared[engine] = host;
            }

            return host;
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>A connection string to a new, empty database of the engine.</summary>
    public async Task<string> NewDatabaseAsync(string engine)
    {
        await _gate.WaitAsync();
        try
        {
            return await DatabaseAsync(engine, $"db{++_databases}");
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>A host of its own on a new, empty database; the caller disposes it.</summary>
    public async Task<ServiceHost> ServiceHostOnNewDatabaseAsync(string engine) => new(engine, await NewDatabaseAsync(engine));

    public async Task DisposeAsync()
    {
        foreach (var host in _shared.Values)
        {
            await host.DisposeAsync();
        }

        if (_postgres is not null)
        {
            await _postgres.DisposeAsync();
        }

        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_sqliteDir, recursive: true);
    }

    private async Task<string> DatabaseAsync(string engine, string name)
    {
        if (engine == "Sqlite")
        {
            return $"Data Source={Path.Combine(_sqliteDir, name, "geldispense.db")}";
        }

        _postgres ??= await PostgresServer.StartAsync();
        return await _postgres.CreateDatabaseAsync($"geldispense_{name}");
    }
}
