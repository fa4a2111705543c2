using System.Text.Json.Nodes;
using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Errors;

[Collection(ApiCollection.Name)]
public sealed class MalformedBodyTests(ApiHosts hosts)
{
    private static readonly string[] Bodies =
    [
        "",
        "{",
        "not json",
        "[1,2,3]",
        "null",
        "\"a string\"",
        """{"recipe":{"name":"x","temperatureC":"hot"}}""",
        """{"recipe":{"name":"x","temperatureC":"NaN","components":[{"reagentId":"teos","amount":{"value":1,"unit":"g"}}]}}""",
        """{"recipe":{"name":"x","components":[{"reagentId":"teos","amount":{"value":1e400,"unit":"g"}}]}}""",
        """{"recipe":{"name":"x","components":[{"reagentId":"teos","amount":{"value":-3,"unit":"g"}}]}}""",
        """{"stationId":42,"recipe":{}}""",
        """{"stepIndex":"first","readingG":true}""",
        """{"readingG":1e999,"stable":true,"additionId":"m1","stepIndex":0}""",
        """{"reagent":{"id":"Bad Id!","role":"wizard"}}""",
        """{"lotId":["a"],"expiresOn":"tomorrow"}""",
        """{"balance":{"readabilityG":-1,"capacityG":0,"accuracyClass":"V"}}""",
    ];

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Every_POST_route_answers_every_malformed_body_with_a_4xx_and_a_reason(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var batchId = (string)(await Demo.StartBatchAsync(client))["id"]!;
        string[] routes =
        [
            "/v1/compositions:evaluate", "/v1/plans", "/v1/reagents", "/v1/reagents/teos/lots", "/v1/batches",
            $"/v1/batches/{batchId}/additions", $"/v1/batches/{batchId}:abort",
        ];
        var component = """{"reagentId":"teos","amount":{"value":1,"unit":"g"}}""";
        var oversized = "{\"recipe\":{\"name\":\"big\",\"components\":[" + string.Join(",", Enumerable.Repeat(component, 200)) + "]}}";
        var huge = "{\"recipe\":{\"name\":\"" + new string('x', 300_000) + "\"}}";

        foreach (var route in routes)
        {
            foreach (var body in Bodies.Append(oversized).Append(huge))
            {
                using var response = await client.PostAsync(route, Demo.Json(body));
                var text = await response.Content.ReadAsStringAsync();
                var status = (int)response.StatusCode;
                if (status is >= 200 and < 300 && route.EndsWith(":abort", StringComparison.Ordinal))
                {
                    // An abort accepts any body it can read: the reason is optional. Re-open a batch for the rest.
                    continue;
                }

                Assert.True(status is >= 400 and < 500, $"POST {route} with {Clip(body)} gave {status}: {Clip(text)}");
                var reason = (string?)JsonNode.Parse(text)?["errors"]?[0]?["reason"];
                Assert.False(string.IsNullOrWhiteSpace(reason), $"POST {route} with {Clip(body)} gave no reason: {Clip(text)}");
            }
        }
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Seeded_byte_mutations_of_valid_bodies_never_get_a_5xx_and_every_refusal_has_a_reason(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var batch = await Demo.StartBatchAsync(client, stationId: "bench-fuzz");
        var valid = new (string Route, string Body)[]
        {
            ("/v1/plans", $$"""{"recipe":{{Demo.DensityRecipe}},"balance":{{Demo.Balance}}}"""),
            ("/v1/batches", $$"""{"stationId":"bench-fuzz","recipe":{{Demo.Recipe}},"balance":{{Demo.Balance}}}"""),
            ($"/v1/batches/{batch["id"]}/additions", Demo.Addition("fz1", 0, 20.8)),
            ("/v1/reagents", """{"id":"ipa-fuzz","name":"2-propanol","formula":"C3H8O","densityGPerMl":0.7855,"role":"solvent"}"""),
        };
        var random = new Random(4711);
        foreach (var (route, text) in valid)
        {
            var bytes = System.Text.Encoding.UTF8.GetBytes(text);
            for (var trial = 0; trial < 150; trial++)
            {
                var mutated = (byte[])bytes.Clone();
                for (var flips = random.Next(1, 4); flips > 0; flips--)
                {
                    mutated[random.Next(mutated.Length)] = (byte)random.Next(32, 127);
                }

                using var content = new ByteArrayContent(mutated);
                content.Headers.ContentType = new System.Net.Http.Headers.MediaTypeHeaderValue("application/json");
                using var response = await client.PostAsync(route, content);
                var answer = await response.Content.ReadAsStringAsync();
                var status = (int)response.StatusCode;

                Assert.True(status < 500, $"POST {route} with {Clip(System.Text.Encoding.UTF8.GetString(mutated))} gave {status}: {Clip(answer)}");
                if (status >= 400)
                {
                    Assert.False(string.IsNullOrWhiteSpace((string?)JsonNode.Parse(answer)?["errors"]?[0]?["reason"]), $"POST {route} gave {status} without a reason: {Clip(answer)}");
                }
            }
        }
    }

    private static string Clip(string text) => text.Length <= 120 ? text : text[..120] + "…";
}
