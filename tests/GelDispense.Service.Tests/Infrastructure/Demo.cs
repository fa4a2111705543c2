using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>Our own demo scenario: a TEOS : ethanol : water = 1 : 4 : 4 silica sol of 0.1 mol TEOS, weighed at station "bench-2".</summary>
public static class Demo
{
    public const string Recipe = """
        {"name":"silica-r4","components":[
          {"reagentId":"teos","amount":{"value":1,"unit":"ratio"}},
          {"reagentId":"ethanol","amount":{"value":4,"unit":"ratio"}},
          {"reagentId":"water","amount":{"value":4,"unit":"ratio"}}],
         "scale":{"precursorMol":0.1},
         "spec":{"hydrolysisRatio":{"value":4,"tolerancePct":2}}}
        """;

    /// <summary>
    /// The same sol held to an oxide density as well: ethanol is the free solvent the planner solves for
    /// 0.080 g/mL SiO2 ± 3 %, with R = 4 ± 2 %.
    /// </summary>
    public const string DensityRecipe = """
        {"name":"silica-r4-d80","components":[
          {"reagentId":"teos","amount":{"value":1,"unit":"ratio"}},
          {"reagentId":"ethanol","amount":{"value":4,"unit":"ratio"}},
          {"reagentId":"water","amount":{"value":4,"unit":"ratio"}}],
         "scale":{"precursorMol":0.1},
         "spec":{"hydrolysisRatio":{"value":4,"tolerancePct":2},
                 "oxideDensityGPerMl":{"value":0.08,"tolerancePct":3},"freeSolventIds":["ethanol"]}}
        """;

    public const string Balance = """{"id":"bal-7","readabilityG":0.001,"capacityG":220,"repeatabilityG":0.0008}""";

    public static StringContent Json(string json) => new(json, Encoding.UTF8, "application/json");

    public static async Task<JsonNode> PostAsync(HttpClient client, string path, string json, int expectedStatus = 200)
    {
        using var response = await client.PostAsync(path, Json(json));
        var body = await response.Content.ReadAsStringAsync();
        Assert.True((int)response.StatusCode == expectedStatus, $"POST {path} gave {(int)response.StatusCode}: {body}");
        return JsonNode.Parse(body)!;
    }

    public static async Task<JsonNode> GetAsync(HttpClient client, string path, int expectedStatus = 200)
    {
        using var response = await client.GetAsync(path);
        var body = await response.Content.ReadAsStringAsync();
        Assert.True((int)response.StatusCode == expectedStatus, $"GET {path} gave {(int)response.StatusCode}: {body}");
        return JsonNode.Parse(body)!;
    }

    /// <summary>Starts a demo batch over REST and returns it.</summary>
    public static Task<JsonNode> StartBatchAsync(HttpClient client, string stationId = "bench-2", string recipe = Recipe) =>
        PostAsync(client, "/v1/batches", $$"""{"stationId":"{{stationId}}","recipe":{{recipe}},"balance":{{Balance}}}""");

    public static string Addition(string additionId, int stepIndex, double readingG, bool stable = true) =>
        JsonSerializer.Serialize(new { additionId, stepIndex, readingG, stable });
}
