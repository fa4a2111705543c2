using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Api;

[Collection(ApiCollection.Name)]
public sealed class ReagentDirectoryTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_custom_reagent_stored_over_REST_counts_in_a_recipe_at_once(string engine)
    {
        var client = (await hosts.ForAsync(engine)).CreateClient();
        var id = $"ipa-{Guid.NewGuid():N}"[..20];
        // 2-propanol: C3H8O = 3 × 12.011 + 8 × 1.008 + 15.999 = 60.096 g/mol (IUPAC conventional atomic weights).
        await Demo.PostAsync(client, "/v1/reagents", $$"""
            {"id":"{{id}}","name":"2-propanol, dried","formula":"C3H8O","densityGPerMl":0.7855,"role":"solvent"}
            """);
        var recipe = Demo.Recipe.Replace("\"ethanol\"", $"\"{id}\"", StringComparison.Ordinal);

        var composition = await Demo.PostAsync(client, "/v1/compositions:evaluate", $$"""{"recipe":{{recipe}}}""");

        var solvent = composition["components"]!.AsArray().Single(c => (string)c!["reagentId"]! == id)!;
        Assert.Equal(0.4 * 60.096, (double)solvent["massG"]!, 2);
    }
}
