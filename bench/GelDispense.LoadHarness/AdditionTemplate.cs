using Npgsql;

namespace GelDispense.LoadHarness;

/// <summary>
/// One addition row as the service stored it, read back column by column, so the raw insert loop writes rows with
/// the same columns and sizes as the service (its stored response included), even after the table gains columns.
/// Only the keys and the time vary from row to row.
/// </summary>
public sealed class AdditionTemplate
{
    private static readonly string[] Varying = ["batch_id", "addition_id", "ordinal", "recorded_at"];

    private readonly string[] _columns;
    private readonly object[] _values;

    private AdditionTemplate(string[] columns, object[] values) => (_columns, _values) = (columns, values);

    public static async Task<AdditionTemplate> ReadAsync(string connectionString, string batchId, string additionId)
    {
        await using var connection = new NpgsqlConnection(connectionString);
        await connection.OpenAsync();
        await using var select = new NpgsqlCommand("SELECT * FROM additions WHERE batch_id = @batchId AND addition_id = @additionId", connection)
        {
            Parameters = { new("batchId", batchId), new("additionId", additionId) },
        };
        await using var reader = await select.ExecuteReaderAsync();
        if (!await reader.ReadAsync())
        {
            throw new InvalidOperationException($"Addition {additionId} of batch {batchId} is not in the additions table.");
        }

        var values = new object[reader.FieldCount];
        reader.GetValues(values);
        var columns = Enumerable.Range(0, reader.FieldCount).Select(reader.GetName).ToArray();
        var missing = Varying.Except(columns).ToArray();
        return missing.Length == 0
            ? new AdditionTemplate(columns, values)
            : throw new InvalidOperationException($"The additions table has no column {string.Join(", ", missing)}.");
    }

    /// <summary>A plain parameterised INSERT of every column, one row per execution, as a hand-written ingest loop would send.</summary>
    public NpgsqlCommand InsertCommand(NpgsqlConnection connection)
    {
        var insert = new NpgsqlCommand(
            $"INSERT INTO additions ({string.Join(", ", _columns)}) VALUES ({string.Join(", ", _columns.Select((_, i) => $"@p{i}"))})", connection);
        for (var i = 0; i < _columns.Length; i++)
        {
            insert.Parameters.Add(new NpgsqlParameter($"p{i}", _values[i]));
        }

        return insert;
    }

    /// <summary>Sets the row's keys and time in a command from <see cref="InsertCommand"/>.</summary>
    public void Vary(NpgsqlCommand insert, string batchId, string additionId, int ordinal, string recordedAt)
    {
        insert.Parameters[Array.IndexOf(_columns, "batch_id")].Value = batchId;
        insert.Parameters[Array.IndexOf(_columns, "addition_id")].Value = additionId;
        insert.Parameters[Array.IndexOf(_columns, "ordinal")].Value = ordinal;
        insert.Parameters[Array.IndexOf(_columns, "recorded_at")].Value = recordedAt;
    }
}
