using System.Globalization;
using GelDispense.Service.Storage;
using Npgsql;

namespace GelDispense.LoadHarness;

/// <summary>
/// The baseline: one loop of plain INSERTs into the service's additions table on its own unpooled connection, each
/// row like <paramref name="template"/> on a batch of its own (<paramref name="batchId"/>), one statement and one
/// commit per addition, nothing read and nothing computed.
/// </summary>
public sealed class RawAdditionInsert(string connectionString, AdditionTemplate template, string batchId, TimeProvider time) : ILoadClient
{
    private readonly NpgsqlConnection _connection = new(new NpgsqlConnectionStringBuilder(connectionString) { Pooling = false }.ConnectionString);
    private NpgsqlCommand? _insert;

    // The template's own row on the first batch holds ordinal 0.
    private int _ordinal;

    public async Task PrepareAsync(CancellationToken cancellationToken)
    {
        if (_insert is null)
        {
            await _connection.OpenAsync(cancellationToken);
            _insert = template.InsertCommand(_connection);
        }
    }

    public async Task CallAsync(CancellationToken cancellationToken)
    {
        var ordinal = ++_ordinal;
        template.Vary(_insert!, batchId, string.Create(CultureInfo.InvariantCulture, $"raw-{ordinal}"), ordinal, TimeText.Format(time.GetUtcNow()));
        await _insert!.ExecuteNonQueryAsync(cancellationToken);
    }

    public void Dispose()
    {
        _insert?.Dispose();
        _connection.Dispose();
    }
}
