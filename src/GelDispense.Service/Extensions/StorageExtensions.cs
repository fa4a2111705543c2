using GelDispense.Service.Storage;

namespace GelDispense.Service.Extensions;

/// <summary>Chooses the database from <c>Storage:Provider</c> (Sqlite by default, or Postgres) and migrates it at start.</summary>
public static class StorageExtensions
{
    public const string ConnectionName = "GelDispense";
    public const string DefaultSqlite = "Data Source=data/geldispense.db";

    public static IServiceCollection AddGelDispenseStorage(this IServiceCollection services, IConfiguration configuration)
    {
        services.AddSingleton<IDatabase>(provider => Create(configuration, provider.GetRequiredService<TimeProvider>()));
        services.AddSingleton<ReagentStore>();
        services.AddSingleton<BatchStore>();
        services.AddHostedService<MigrationHostedService>();
        return services;
    }

    private static Database Create(IConfiguration configuration, TimeProvider time)
    {
        var provider = configuration["Storage:Provider"] ?? "Sqlite";
        var connectionString = configuration.GetConnectionString(ConnectionName);
        return provider.ToUpperInvariant() switch
        {
            "SQLITE" => new SqliteDatabase(connectionString ?? DefaultSqlite, time),
            "POSTGRES" or "POSTGRESQL" => new PostgresDatabase(connectionString
                ?? throw new InvalidOperationException("Storage:Provider=Postgres needs ConnectionStrings:GelDispense."), time),
            _ => throw new InvalidOperationException($"Storage:Provider '{provider}' is not known; use Sqlite or Postgres."),
        };
    }
}
