using Grpc.Core;
using Polly;
using Polly.CircuitBreaker;
using Polly.Retry;

namespace GelDispense.Agent.Service;

/// <summary>
/// The Polly pipelines around gRPC calls. gRPC reports failures as a status in the trailers of an HTTP 200
/// response, which the HTTP resilience handlers never see, so the pipeline wraps the call itself and handles
/// <see cref="RpcException"/>. gRPC's own service-config retries stay off, so nothing retries twice.
/// Retry is the outer strategy and the breaker the inner one: every attempt counts toward the breaker, and an
/// open circuit (<see cref="BrokenCircuitException"/>) is not retried, so an outage costs one quick failure.
/// </summary>
public static class ServiceResilience
{
    /// <summary>For idempotent calls (reads, additions with their addition id): every transient status is retried.</summary>
    public static ResiliencePipeline Idempotent(ServiceLinkSettings settings, TimeProvider time) =>
        Build(settings, time, ServiceFaults.IsTransient);

    /// <summary>
    /// For calls that are not idempotent (starting a batch): only a call that could not connect is retried
    /// (<see cref="ServiceFaults.CouldNotConnect"/>). A deadline, a connection broken under the call or an UNAVAILABLE
    /// from the service itself may come after the service acted, so retrying them could start a second batch.
    /// </summary>
    public static ResiliencePipeline NotIdempotent(ServiceLinkSettings settings, TimeProvider time) =>
        Build(settings, time, ServiceFaults.CouldNotConnect);

    private static ResiliencePipeline Build(ServiceLinkSettings settings, TimeProvider time, Func<RpcException, bool> retryable) =>
        new ResiliencePipelineBuilder { TimeProvider = time }
            .AddRetry(new RetryStrategyOptions
            {
                ShouldHandle = new PredicateBuilder().Handle(retryable),
                MaxRetryAttempts = settings.RetryAttempts,
                BackoffType = DelayBackoffType.Exponential,
                UseJitter = true,
                Delay = settings.RetryFirstDelay,
                MaxDelay = settings.RetryMaxDelay,
            })
            .AddCircuitBreaker(new CircuitBreakerStrategyOptions
            {
                ShouldHandle = new PredicateBuilder().Handle<RpcException>(ServiceFaults.IsTransient),
                FailureRatio = settings.BreakerFailureRatio,
                SamplingDuration = settings.BreakerSampling,
                MinimumThroughput = settings.BreakerMinimumCalls,
                BreakDuration = settings.BreakerOpenFor,
            })
            .Build();
}
