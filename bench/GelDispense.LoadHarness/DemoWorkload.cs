using System.Globalization;
using System.Text.Json.Nodes;
using GelDispense.Contracts.V1;
using Google.Protobuf;

namespace GelDispense.LoadHarness;

/// <summary>
/// The calls the harness makes, all from our own demo: the 8-component TEOS–MTMS hybrid monolith H-73 (recipe in
/// demo-hybrid-monolith.json: R 4.0 ± 2 %, 0.060 g/mL oxide ± 3 %, 250 mL gel) on a 620 g precision balance with a
/// 100–1000 µL pipette at station "bench-3".
/// </summary>
public sealed class DemoWorkload
{
    public const string RecipeFile = "demo-hybrid-monolith.json";
    public const string StationId = "bench-3";

    private const string BalanceJson = """{"id":"bal-620","readabilityG":0.001,"capacityG":620,"repeatabilityG":0.001}""";
    private const string PipetteJson = """{"id":"P1000-bench-3","nominalVolumeUl":1000,"minVolumeUl":100}""";

    private const string VolumeMark = "@gel-volume@";

    private readonly string _recipeJson;
    private readonly string _planAtVolumeHead;
    private readonly string _planAtVolumeTail;
    private long _freshVolumes;

    private DemoWorkload(JsonNode recipe)
    {
        _recipeJson = recipe.ToJsonString();
        PlanJson = PlanBody(_recipeJson);
        BatchJson = BatchJsonFor(StationId);
        PlanRequest = JsonParser.Default.Parse<CreatePlanRequest>(PlanJson);
        recipe["scale"] = new JsonObject { ["gelVolumeMl"] = VolumeMark };
        var template = PlanBody(recipe.ToJsonString()).Split($"\"{VolumeMark}\"");
        (_planAtVolumeHead, _planAtVolumeTail) = (template[0], template[1]);
    }

    /// <summary>Body of POST /v1/plans.</summary>
    public string PlanJson { get; }

    /// <summary>Body of POST /v1/batches.</summary>
    public string BatchJson { get; }

    /// <summary>Body of POST /v1/batches for the demo batch at another station.</summary>
    public string BatchJsonFor(string stationId) =>
        $$"""{"stationId":"{{stationId}}","recipe":{{_recipeJson}},"balance":{{BalanceJson}},"pipette":{{PipetteJson}}}""";

    /// <summary>The demo batch at <paramref name="stationId"/> for gRPC.</summary>
    public CreateBatchRequest BatchRequestFor(string stationId) => JsonParser.Default.Parse<CreateBatchRequest>(BatchJsonFor(stationId));

    /// <summary>The same plan request for gRPC.</summary>
    public CreatePlanRequest PlanRequest { get; }

    /// <summary>
    /// Body of POST /v1/plans for the demo at another gel volume: a request the service has not seen, so it must
    /// compute the plan instead of answering from its memo of plans already made.
    /// </summary>
    public string PlanJsonAt(double gelVolumeMl) =>
        string.Concat(_planAtVolumeHead, gelVolumeMl.ToString("R", CultureInfo.InvariantCulture), _planAtVolumeTail);

    /// <summary>A gel volume no earlier call of this run used: 250 mL plus 0.1 µL per call.</summary>
    public double FreshGelVolumeMl() => 250 + (Interlocked.Increment(ref _freshVolumes) * 1e-4);

    /// <summary>The gRPC request at another gel volume (see <see cref="PlanJsonAt"/>).</summary>
    public CreatePlanRequest PlanRequestAt(double gelVolumeMl)
    {
        var request = PlanRequest.Clone();
        request.Recipe.Scale.GelVolumeMl = gelVolumeMl;
        return request;
    }

    public static DemoWorkload Load()
    {
        var path = Path.Combine(AppContext.BaseDirectory, RecipeFile);
        // Parsing once here turns a broken file into one clear error before any load is made.
        var recipe = JsonNode.Parse(File.ReadAllText(path)) ?? throw new InvalidDataException($"{path}: empty recipe file.");
        return new DemoWorkload(recipe);
    }

    private static string PlanBody(string recipeJson) =>
        $$"""{"recipe":{{recipeJson}},"balance":{{BalanceJson}},"pipette":{{PipetteJson}}}""";
}
