using Dapper;
using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace GelDispense.Service.Storage;

/// <summary>Healthy when the database answers a trivial query on the migrated schema.</summary>
public sealed class StorageHealthCheck(IDatabase database) : IHealthCheck
{
    public async Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        try
        {
            await using var connection = await database.OpenAsync(cancellationToken);
            await connection.ExecuteScalarAsync<long>(new CommandDefinition("SELECT last_seq FROM event_sequence WHERE id = 1", cancellationToken: cancellationToken));
            return HealthCheckResult.Healthy($"{database.Engine} answers");
        }
        catch (Exception e) when (e is System.Data.Common.DbException or InvalidOperationException or TimeoutException)
        {
            return HealthCheckResult.Unhealthy($"{database.Engine} does not answer", e);
        }
    }
}
