using GelDispense.Service.Tests.Infrastructure;
using Npgsql;

namespace GelDispense.ScaleOut.Tests.Support;

/// <summary>
/// Two service processes, A and B, on one fresh PostgreSQL database of a shared throwaway cluster. A starts first on
/// the empty database, runs the migrations and writes the bootstrap admin key; B then starts on the same database and
/// must find it migrated and keyed (it writes no key of its own).
/// </summary>
internal sealed class ReplicaPair : IAsyncDisposable
{
    private readonly string _keyDirectory;

    private ReplicaPair(ServiceProcess a, ServiceProcess b, string adminKey, string keyDirectory)
    {
        A = a;
        B = b;
        AdminKey = adminKey;
        _keyDirectory = keyDirectory;
    }

    public ServiceProcess A { get; }

    public ServiceProcess B { get; }

    public string AdminKey { get; }

    public static async Task<ReplicaPair> StartAsync(LocalPostgres cluster, string database)
    {
        await using (var connection = new NpgsqlConnection(cluster.ConnectionString))
        {
            await connection.OpenAsync();
            await using var create = new NpgsqlCommand($"CREATE DATABASE \"{database}\"", connection);
            await create.ExecuteNonQueryAsync();
        }

        var connectionString = new NpgsqlConnectionStringBuilder(cluster.ConnectionString) { Database = database }.ConnectionString;
        var keyDirectory = Path.Combine(Path.GetTempPath(), $"geldispense-scaleout-{Guid.NewGuid():N}");
        Directory.CreateDirectory(keyDirectory);
        var a = await ServiceProcess.StartAsync(connectionString, keyDirectory, "A");
        try
        {
            var b = await ServiceProcess.StartAsync(connectionString, keyDirectory, "B");
            return new ReplicaPair(a, b, (await File.ReadAllTextAsync(a.BootstrapKeyFile)).Trim(), keyDirectory);
        }
        catch
        {
            await a.DisposeAsync();
            Directory.Delete(keyDirectory, recursive: true);
            throw;
        }
    }

    public async ValueTask DisposeAsync()
    {
        await A.DisposeAsync();
        await B.DisposeAsync();
        Directory.Delete(_keyDirectory, recursive: true);
    }
}
