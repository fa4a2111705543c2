using System.Globalization;
using System.Text.Json.Nodes;

namespace GelDispense.LoadHarness;

/// <summary>
/// A station making demo batches one after another over REST: starts a batch (untimed), then records each step at
/// its target reading, in order (timed). Each client has its own batches, so clients never contend for one batch.
/// </summary>
public sealed class AdditionSequence(Uri baseAddress, string? apiKey, string batchJson, int clientIndex) : ILoadClient
{
    private readonly HttpClient _http = RestCall.Connect(baseAddress, apiKey);
    private string _batchId = "";
    private JsonArray _steps = [];
    private int _next;
    private int _serial;

    public async Task PrepareAsync(CancellationToken cancellationToken)
    {
        if (_next < _steps.Count)
        {
            return;
        }

        var batch = JsonNode.Parse(await RestCall.PostAsync(_http, "/v1/batches", batchJson, cancellationToken))!;
        _batchId = (string)batch["id"]!;
        _steps = batch["steps"]!.AsArray();
        _next = 0;
    }

    public async Task CallAsync(CancellationToken cancellationToken)
    {
        var step = _steps[_next++]!;
        var additionId = string.Create(CultureInfo.InvariantCulture, $"load-{clientIndex}-{++_serial}");
        var body = new JsonObject
        {
            ["additionId"] = additionId,
            ["stepIndex"] = (int)step["index"]!,
            ["readingG"] = (double)step["targetReadingG"]!,
            ["stable"] = true,
        };
        var answer = JsonNode.Parse(await RestCall.PostAsync(_http, $"/v1/batches/{_batchId}/additions", body.ToJsonString(), cancellationToken))!;
        if ((bool?)answer["addition"]?["withinWindow"] != true)
        {
            throw new InvalidOperationException($"{additionId}: a reading at the target was judged out of window: {answer.ToJsonString()[..200]}");
        }
    }

    public void Dispose() => _http.Dispose();
}
