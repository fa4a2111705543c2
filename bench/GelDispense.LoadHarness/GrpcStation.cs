using System.Globalization;
using GelDispense.Contracts.V1;
using Grpc.Core;
using Grpc.Net.Client;

namespace GelDispense.LoadHarness;

/// <summary>
/// A station making demo batches one after another over gRPC, with its own channel and its own station key, as the
/// agent does: starts a batch (untimed), then records each step at its target reading, in order (timed).
/// </summary>
public sealed class GrpcStation(Uri address, StationKey station, CreateBatchRequest batch) : ILoadClient
{
    private readonly GrpcChannel _channel = GrpcChannel.ForAddress(address);
    private readonly Metadata? _headers = GrpcCall.Headers(station.Key);
    private string _batchId = "";
    private PlanStep[] _steps = [];
    private int _next;
    private int _serial;

    public async Task PrepareAsync(CancellationToken cancellationToken)
    {
        if (_next < _steps.Length)
        {
            return;
        }

        var started = await Client().CreateBatchAsync(batch, _headers, cancellationToken: cancellationToken);
        (_batchId, _steps, _next) = (started.Id, [.. started.Steps], 0);
    }

    public async Task CallAsync(CancellationToken cancellationToken)
    {
        var step = _steps[_next++];
        var request = new RecordAdditionRequest
        {
            BatchId = _batchId,
            AdditionId = string.Create(CultureInfo.InvariantCulture, $"{station.StationId}-{++_serial}"),
            StepIndex = step.Index,
            ReadingG = step.TargetReadingG,
            Stable = true,
        };
        var answer = await Client().RecordAdditionAsync(request, _headers, cancellationToken: cancellationToken);
        if (!answer.Addition.WithinWindow)
        {
            throw new InvalidOperationException($"{request.AdditionId}: a reading at the target was judged out of window.");
        }
    }

    public void Dispose() => _channel.Dispose();

    private BatchService.BatchServiceClient Client() => new(_channel);
}
