using GelDispense.Contracts.V1;
using Grpc.Core;
using Polly;

namespace GelDispense.Agent.Service;

/// <summary>
/// The batch calls the station makes, each inside a Polly pipeline and with its own deadline. The link keeps a
/// <see cref="Status"/> for the display: online after any answer, offline when a call could not reach the service.
/// A call that fails for good (bad input, a closed batch) throws its <see cref="RpcException"/> without retries.
/// </summary>
public sealed class ServiceLink
{
    private readonly BatchService.BatchServiceClient _client;
    private readonly ResiliencePipeline _idempotent;
    private readonly ResiliencePipeline _notIdempotent;
    private readonly ServiceLinkSettings _settings;
    private readonly TimeProvider _time;
    private readonly Metadata _headers = [];

    public ServiceLink(CallInvoker invoker, string describe, ServiceLinkSettings settings, TimeProvider time, string? apiKey = null)
    {
        _client = new BatchService.BatchServiceClient(invoker);
        _settings = settings;
        _time = time;
        _idempotent = ServiceResilience.Idempotent(settings, time);
        _notIdempotent = ServiceResilience.NotIdempotent(settings, time);
        Describe = describe;
        if (!string.IsNullOrEmpty(apiKey))
        {
            // The service reads the same bearer credential from gRPC metadata as from a REST header.
            _headers.Add("authorization", "Bearer " + apiKey);
        }
    }

    public string Describe { get; }

    public ServiceStatus Status { get; private set; } = ServiceStatus.Unknown;

    public ServiceLinkSettings Settings => _settings;

    /// <summary>Raised on the calling thread when the status changes; handlers must return quickly.</summary>
    public event Action<ServiceStatusChange>? StatusChanged;

    public Task<Batch> CreateBatchAsync(CreateBatchRequest request, CancellationToken cancellationToken) =>
        CallAsync(_notIdempotent, options => _client.CreateBatchAsync(request, options), cancellationToken);

    public Task<Batch> GetBatchAsync(string batchId, CancellationToken cancellationToken) =>
        CallAsync(_idempotent, options => _client.GetBatchAsync(new GetBatchRequest { Id = batchId }, options), cancellationToken);

    /// <summary>Safe to repeat: the service records an addition id once and answers a repeat with the first result.</summary>
    public Task<RecordAdditionResponse> RecordAdditionAsync(RecordAdditionRequest request, CancellationToken cancellationToken) =>
        CallAsync(_idempotent, options => _client.RecordAdditionAsync(request, options), cancellationToken);

    public Task<AsMade> GetAsMadeAsync(string batchId, CancellationToken cancellationToken) =>
        CallAsync(_idempotent, options => _client.GetAsMadeAsync(new GetAsMadeRequest { BatchId = batchId }, options), cancellationToken);

    /// <summary>Completing twice gives the same completed batch, so this is retried like a read.</summary>
    public Task<Batch> CompleteBatchAsync(string batchId, CancellationToken cancellationToken) =>
        CallAsync(_idempotent, options => _client.CompleteBatchAsync(new CompleteBatchRequest { Id = batchId }, options), cancellationToken);

    private async Task<T> CallAsync<T>(ResiliencePipeline pipeline, Func<CallOptions, AsyncUnaryCall<T>> call, CancellationToken cancellationToken)
    {
        try
        {
            var result = await pipeline.ExecuteAsync(
                async token => await call(new CallOptions(_headers, _time.GetUtcNow().UtcDateTime + _settings.CallDeadline, token)).ResponseAsync.ConfigureAwait(false),
                cancellationToken).ConfigureAwait(false);
            Report(ServiceStatus.Online, $"answered at {Describe}");
            return result;
        }
        catch (Exception ex) when (ServiceFaults.IsUnreachable(ex))
        {
            if (!cancellationToken.IsCancellationRequested)
            {
                Report(ServiceStatus.Offline, ServiceFaults.Describe(ex));
            }

            throw;
        }
        catch (RpcException ex) when (ex.StatusCode != StatusCode.Cancelled)
        {
            // A considered answer (refusal) still proves the service is there.
            Report(ServiceStatus.Online, $"answered at {Describe}");
            throw;
        }
    }

    private void Report(ServiceStatus status, string reason)
    {
        if (status == Status)
        {
            return;
        }

        Status = status;
        StatusChanged?.Invoke(new ServiceStatusChange(status, reason, _time.GetUtcNow()));
    }
}
