using GelDispense.Service.Api;
using GelDispense.Service.Batches;
using GelDispense.Service.Errors;
using GelDispense.Service.Storage;

namespace GelDispense.Service.Extensions;

/// <summary>Everything the host registers: gRPC with JSON transcoding, OpenAPI, health, storage and the batch ledger.</summary>
public static class ServiceCollectionExtensions
{
    public static IServiceCollection AddGelDispenseServices(this IServiceCollection services, IConfiguration configuration)
    {
        var limits = configuration.GetSection(RequestLimits.Section).Get<RequestLimits>() ?? new RequestLimits();
        services.AddSingleton(limits);
        services.AddSingleton(TimeProvider.System);
        services.AddSingleton(Random.Shared);

        services.AddGrpc(options =>
        {
            options.Interceptors.Add<ErrorMappingInterceptor>();
            options.MaxReceiveMessageSize = limits.MaxRequestBodyBytes;
        }).AddJsonTranscoding(options =>
            // Error details are packed as Any; the transcoder can only write the types it is told about.
            options.TypeRegistry = Google.Protobuf.Reflection.TypeRegistry.FromMessages(Google.Rpc.BadRequest.Descriptor));
        services.AddGrpcReflection();
        services.AddGelDispenseHealth();
        services.AddGelDispenseSwagger();

        services.AddGelDispenseStorage(configuration);
        services.AddGelDispenseSecurity(configuration);
        services.AddSingleton<ReagentDirectory>();
        services.AddSingleton<SerializedAnswers>();
        services.AddSingleton<PlanMemo>();
        services.AddSingleton<RestAnswerMemo>();
        services.AddSingleton<Planner>();
        services.AddSingleton<BatchEventSignal>();
        services.AddSingleton<BatchLedger>();
        services.AddSingleton<BatchPlanCache>();
        services.AddSingleton<BatchProgressMemo>();
        services.AddSingleton<AdditionRecorder>();
        services.AddSingleton<AdditionCorrector>();
        services.AddSingleton<PlanHistory>();
        services.AddSingleton<AuditVerifier>();
        services.AddScoped<RequestLog>();

        // Last: the health, reflection and Swagger registrations call AddGrpc again, which would bring the default binder back.
        return services.AddServiceMethodBinding();
    }
}
