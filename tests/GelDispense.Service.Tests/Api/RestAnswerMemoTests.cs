using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;

namespace GelDispense.Service.Tests.Api;

[Collection(ApiCollection.Name)]
public sealed class RestAnswerMemoTests(ApiHosts hosts)
{
    // The hosts are shared by the API tests, so each body carries its own recipe name: a first call here is a first call.
    private static string UniqueRecipe() =>
        Demo.DensityRecipe.Replace("\"silica-r4-d80\"", $"\"memo-{Guid.NewGuid():N}\"", StringComparison.Ordinal);

    private static string PlanBody() => $$"""{"recipe":{{UniqueRecipe()}},"balance":{{Demo.Balance}}}""";

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_repeated_plan_request_gets_the_very_bytes_of_the_first_answer_from_the_memo(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var body = PlanBody();

        var (firstStatus, firstCache, firstType, first) = await PostAsync(client, "/v1/plans", body);
        var (secondStatus, secondCache, secondType, second) = await PostAsync(client, "/v1/plans", body);

        Assert.Equal((200, 200), (firstStatus, secondStatus));
        Assert.Equal("GelDispense; fwd=miss; stored", firstCache);
        Assert.Equal("GelDispense; hit", secondCache);
        Assert.Equal(firstType, secondType);
        Assert.Equal(first, second);
        Assert.Contains("\"steps\"", System.Text.Encoding.UTF8.GetString(second), StringComparison.Ordinal);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_remembered_answer_is_still_refused_to_callers_the_route_does_not_admit(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var body = PlanBody();
        await PostAsync(host.CreateClient(), "/v1/plans", body);

        var (limsStatus, limsCache, _, _) = await PostAsync(host.ClientWith(await host.IssueKeyAsync(Roles.Lims)), "/v1/plans", body);
        var (anonymousStatus, anonymousCache, _, _) = await PostAsync(host.AnonymousClient(), "/v1/plans", body);

        Assert.Equal((403, 401), (limsStatus, anonymousStatus));
        Assert.Null(limsCache);
        Assert.Null(anonymousCache);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_refused_request_is_not_remembered_and_is_refused_again_with_its_reason(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var body = PlanBody().Replace("\"reagentId\":\"ethanol\"", "\"reagentId\":\"ethanol-absolute-lot-unknown\"", StringComparison.Ordinal);

        var (firstStatus, firstCache, _, _) = await PostAsync(client, "/v1/plans", body);
        var (secondStatus, secondCache, _, second) = await PostAsync(client, "/v1/plans", body);

        Assert.Equal((400, 400), (firstStatus, secondStatus));
        Assert.Equal("GelDispense; fwd=miss", firstCache);
        Assert.Equal("GelDispense; fwd=miss", secondCache);
        Assert.Contains("ethanol-absolute-lot-unknown", System.Text.Encoding.UTF8.GetString(second), StringComparison.Ordinal);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_body_that_differs_in_any_byte_is_computed_for_itself(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var body = PlanBody();
        await PostAsync(client, "/v1/plans", body);

        var (status, cache, _, answer) = await PostAsync(client, "/v1/plans", body.Replace("\"precursorMol\":0.1", "\"precursorMol\":0.2", StringComparison.Ordinal));

        Assert.Equal(200, status);
        Assert.Equal("GelDispense; fwd=miss; stored", cache);
        // Twice the precursor: the first step (TEOS, M = 208.33 g/mol by IUPAC atomic weights) is about 41.7 g, not 20.8 g.
        var plan = System.Text.Json.Nodes.JsonNode.Parse(answer)!;
        Assert.Equal(41.67, (double)plan["steps"]![0]!["targetMassG"]!, 1);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Evaluating_a_composition_is_remembered_too_but_recording_an_addition_never_is(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var evaluate = $$"""{"recipe":{{UniqueRecipe()}}}""";
        await PostAsync(client, "/v1/compositions:evaluate", evaluate);
        var (_, evaluateCache, _, _) = await PostAsync(client, "/v1/compositions:evaluate", evaluate);

        var batch = await Demo.StartBatchAsync(client, stationId: "bench-memo");
        var (additionStatus, additionCache, _, _) = await PostAsync(client, $"/v1/batches/{(string)batch["id"]!}/additions", Demo.Addition("memo-a1", 0, 20.8));

        Assert.Equal("GelDispense; hit", evaluateCache);
        Assert.Equal(200, additionStatus);
        Assert.Null(additionCache);
    }

    private static async Task<(int Status, string? CacheStatus, string? ContentType, byte[] Body)> PostAsync(HttpClient client, string path, string json)
    {
        using var response = await client.PostAsync(path, Demo.Json(json));
        var cache = response.Headers.TryGetValues("Cache-Status", out var values) ? string.Join(",", values) : null;
        return ((int)response.StatusCode, cache, response.Content.Headers.ContentType?.ToString(), await response.Content.ReadAsByteArrayAsync());
    }
}
