using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Batches;

[Collection(ApiCollection.Name)]
public sealed class AdditionsCsvTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_row_keeps_the_target_and_band_its_addition_was_judged_against_after_a_re_plan(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var batch = await Demo.StartBatchAsync(client);
        var id = (string)batch["id"]!;
        var teos = batch["steps"]![0]!;
        await Demo.PostAsync(client, $"/v1/batches/{id}/additions", Demo.Addition("k1", 0, (double)teos["targetReadingG"]! * 1.05));

        using var response = await client.GetAsync($"/v1/batches:export-csv?batchId={id}");
        var lines = (await response.Content.ReadAsStringAsync()).Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
        var header = lines[0].Split(',');
        var row = lines[1].Split(',');
        string Column(string name) => row[Array.IndexOf(header, name)];

        Assert.Equal("0", Column("plan_revision"));
        Assert.Equal((double)teos["targetMassG"]!, double.Parse(Column("target_mass_g"), System.Globalization.CultureInfo.InvariantCulture), 9);
        Assert.Equal((double)teos["acceptanceG"]!, double.Parse(Column("acceptance_g"), System.Globalization.CultureInfo.InvariantCulture), 9);
        Assert.Equal("false", Column("within_window"));
        var stored = await Demo.GetAsync(client, $"/v1/batches/{id}");
        Assert.Equal((double)teos["targetMassG"]!, (double)stored["additions"]![0]!["targetMassG"]!, 9);
        Assert.NotEqual((double)teos["targetMassG"]!, (double)stored["steps"]![0]!["targetMassG"]!, 6);
    }
}
