namespace GelDispense.Service.Storage;

/// <summary>Migrates at start, so a bad connection string or a failed script stops the host at once instead of on the first request.</summary>
public sealed class MigrationHostedService(IDatabase database, ILogger<MigrationHostedService> logger) : IHostedService
{
    public async Task StartAsync(CancellationToken cancellationToken)
    {
        await database.MigrateAsync(cancellationToken);
        logger.LogInformation("Storage ready on {Engine}", database.Engine);
    }

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;
}
