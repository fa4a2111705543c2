using System.Text;
using System.Text.Json.Nodes;
using GelDispense.Contracts.V1;
using GelDispense.Service.Errors;
using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Errors;

[Collection(ApiCollection.Name)]
public sealed class UnknownJsonFieldsTests(ApiHosts hosts)
{
    private static byte[] Utf8(string json) => Encoding.UTF8.GetBytes(json);

    [Fact]
    public void A_misspelt_nested_field_is_named_by_its_path_with_the_fields_that_exist()
    {
        var json = """{"recipe":{"name":"r","components":[{"reagentId":"teos","amount":{"value":1,"unit":"ratio"}},{"reagentId":"water","amout":{"value":4}}]}}""";

        var error = UnknownJsonFields.Find(Utf8(json), CreatePlanRequest.Descriptor);

        Assert.NotNull(error);
        Assert.Equal("recipe.components[1].amout", error.Field);
        Assert.Contains("no field 'amout'", error.Reason, StringComparison.Ordinal);
        Assert.Contains("amount", error.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Json_names_field_names_timestamps_and_nulls_are_all_accepted()
    {
        // The protobuf JSON mapping reads a field by its lowerCamel JSON name or by its own name; a Timestamp is a string.
        var plan = """{"recipe":{"name":"r","linear_shrinkage":0.1,"components":[{"reagent_id":"teos","amount":null}]},"pipette":null}""";
        var key = """{"role":"station","stationId":"bench-4","expiresAt":"2027-01-31T00:00:00Z"}""";

        Assert.Null(UnknownJsonFields.Find(Utf8(plan), CreatePlanRequest.Descriptor));
        Assert.Null(UnknownJsonFields.Find(Utf8(key), CreateApiKeyRequest.Descriptor));
    }

    [Fact]
    public void Json_that_does_not_parse_is_left_to_the_transcoder_to_report()
    {
        Assert.Null(UnknownJsonFields.Find(Utf8("""{"recipe":{"name":}}"""), CreatePlanRequest.Descriptor));
    }

    [Fact]
    public void Every_truncation_and_thousands_of_byte_flips_of_a_real_body_are_answered_without_an_exception()
    {
        // Bad input never crashes the edge: whatever the bytes, the walk ends with an answer (an error or none).
        var body = Utf8("{\"recipe\":" + Demo.DensityRecipe + ",\"balance\":" + Demo.Balance + ",\"options\":{\"stepLimitPctByReagent\":{\"water\":1}}}");
        var random = new Random(20261202);
        var answered = 0;
        for (var length = 0; length <= body.Length; length++)
        {
            _ = UnknownJsonFields.Find(body.AsSpan(0, length), CreatePlanRequest.Descriptor);
            answered++;
        }

        for (var trial = 0; trial < 5000; trial++)
        {
            var mutated = (byte[])body.Clone();
            for (var flips = random.Next(1, 4); flips > 0; flips--)
            {
                mutated[random.Next(mutated.Length)] = (byte)random.Next(256);
            }

            _ = UnknownJsonFields.Find(mutated, CreatePlanRequest.Descriptor);
            answered++;
        }

        Assert.Equal(body.Length + 1 + 5000, answered);
        Assert.Null(UnknownJsonFields.Find(body, CreatePlanRequest.Descriptor));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_field_name_that_is_not_UTF_8_is_a_400_with_a_reason_not_a_500(string engine)
    {
        var host = await hosts.ForAsync(engine);
        using var body = new ByteArrayContent([.. "{\"rec"u8, 0xA1, .. "ipe\":{}}"u8]);
        body.Headers.ContentType = new System.Net.Http.Headers.MediaTypeHeaderValue("application/json");

        using var response = await host.CreateClient().PostAsync("/v1/plans", body);
        var problem = JsonNode.Parse(await response.Content.ReadAsStringAsync())!;

        Assert.Equal(400, (int)response.StatusCode);
        Assert.False(string.IsNullOrWhiteSpace((string?)problem["errors"]?[0]?["reason"]));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_misspelt_lot_id_is_refused_and_nothing_is_recorded(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var batch = await Demo.StartBatchAsync(client, stationId: "bench-typo");
        var id = (string)batch["id"]!;

        var problem = await Demo.PostAsync(client, $"/v1/batches/{id}/additions",
            """{"additionId":"t1","stepIndex":0,"readingG":20.8,"stable":true,"lotID":"TE-2611-04"}""", 400);
        var after = await Demo.GetAsync(client, $"/v1/batches/{id}");

        var error = problem["errors"]![0]!;
        Assert.Equal("lotID", (string)error["field"]!);
        Assert.Contains("lotId", (string)error["reason"]!, StringComparison.Ordinal);
        Assert.Empty(after["additions"]?.AsArray() ?? []);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_route_whose_body_is_one_field_names_the_path_under_that_field(string engine)
    {
        var host = await hosts.ForAsync(engine);

        var problem = await Demo.PostAsync(host.CreateClient(), "/v1/reagents",
            """{"id":"ipa-typo","name":"2-propanol","formula":"C3H8O","densityGPerMl":0.7855,"role":"solvent","densityAt":20}""", 400);
        var reagents = await Demo.GetAsync(host.CreateClient(), "/v1/reagents");

        Assert.Equal("reagent.densityAt", (string)problem["errors"]![0]!["field"]!);
        Assert.DoesNotContain(reagents["reagents"]!.AsArray(), r => (string)r!["id"]! == "ipa-typo");
    }
}
