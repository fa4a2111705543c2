using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.ScaleOut.Tests.Support;

/// <summary>One throwaway PostgreSQL cluster for the scale-out tests; each test makes its own database on it.</summary>
public sealed class PostgresCluster : IAsyncLifetime
{
    private LocalPostgres? _server;

    public LocalPostgres Server => _server ?? throw new InvalidOperationException("the cluster has not started");

    public async Task InitializeAsync() => _server = await LocalPostgres.StartAsync();

    public async Task DisposeAsync()
    {
        if (_server is not null)
        {
            await _server.DisposeAsync();
        }
    }
}
