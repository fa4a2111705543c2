using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Storage;

[Collection(ApiCollection.Name)]
public sealed class RestartTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task Batches_and_reagents_survive_a_service_restart(string engine)
    {
        var database = await hosts.NewDatabaseAsync(engine);
        string batchId;
        await using (var first = new ServiceHost(engine, database))
        {
            var client = first.CreateClient();
            batchId = (string)(await Demo.StartBatchAsync(client))["id"]!;
            await Demo.PostAsync(client, $"/v1/batches/{batchId}/additions", Demo.Addition("r1", 0, 20.8));
            await Demo.PostAsync(client, "/v1/reagents", """
                {"id":"ipa-dry","name":"2-propanol, dried","formula":"C3H8O","densityGPerMl":0.7855,"role":"solvent"}
                """);
        }

        await using var second = new ServiceHost(engine, database);
        var again = second.CreateClient();
        var batch = await Demo.GetAsync(again, $"/v1/batches/{batchId}");
        var reagent = await Demo.GetAsync(again, "/v1/reagents/ipa-dry");

        Assert.Equal("r1", (string)batch["additions"]![0]!["additionId"]!);
        Assert.Equal(0.7855, (double)reagent["densityGPerMl"]!, 6);
        // The migration ran once: a restart finds the schema recorded and applies nothing again.
        await Demo.PostAsync(again, $"/v1/batches/{batchId}/additions", Demo.Addition("r2", 1, 18.4));
    }
}
