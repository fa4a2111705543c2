using GelDispense.Contracts.V1;
using GelDispense.Service.Tests.Infrastructure;
using Google.Protobuf;
using Google.Rpc;
using Grpc.Core;
using Grpc.Reflection.V1Alpha;

namespace GelDispense.Service.Tests.Errors;

/// <summary>gRPC requests whose bytes are not the message the method takes, sent as a client with a broken encoder would.</summary>
[Collection(ApiCollection.Name)]
public sealed class ParseCheckedServiceMethodsTests(ApiHosts hosts)
{
    private static readonly Marshaller<byte[]> RawBytes = Marshallers.Create(b => b, b => b);

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_truncated_addition_is_refused_as_invalid_argument_naming_the_message_and_records_nothing(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var batchId = (string)(await Demo.StartBatchAsync(host.CreateClient()))["id"]!;
        var whole = new RecordAdditionRequest { BatchId = batchId, AdditionId = "garbled-1", StepIndex = 0, ReadingG = 12.5, Stable = true }.ToByteArray();

        var refused = await Assert.ThrowsAsync<RpcException>(() => CallAsync(host, "BatchService", "RecordAddition", whole[..^3]));

        Assert.Equal(StatusCode.InvalidArgument, refused.StatusCode);
        var violation = Assert.Single(refused.GetRpcStatus()!.GetDetail<BadRequest>().FieldViolations);
        Assert.Equal("request", violation.Field);
        Assert.Contains("do not parse as RecordAdditionRequest", violation.Reason, StringComparison.Ordinal);
        var batch = await Demo.GetAsync(host.CreateClient(), $"/v1/batches/{batchId}");
        Assert.Empty(batch["additions"]?.AsArray() ?? []);
    }

    [Theory, SqliteEngine]
    public async Task Garbage_to_a_unary_and_a_server_streaming_method_is_invalid_argument_while_the_same_path_takes_valid_bytes(string engine)
    {
        var host = await hosts.ForAsync(engine);
        byte[] garbage = [0xFF, 0xFF, 0xFF, 0xFF, 0xFF, 0xFF, 0xFF, 0xFF, 0xFF, 0xFF, 0x01];

        var plan = await Assert.ThrowsAsync<RpcException>(() => CallAsync(host, "PlanService", "CreatePlan", garbage));
        var watch = await Assert.ThrowsAsync<RpcException>(async () =>
        {
            using var call = host.Channel().CreateCallInvoker().AsyncServerStreamingCall(Method(MethodType.ServerStreaming, "BatchService", "WatchBatch"), null, new CallOptions(), garbage);
            await call.ResponseStream.MoveNext(CancellationToken.None);
        });
        var evaluated = Composition.Parser.ParseFrom(await CallAsync(host, "CompositionService", "EvaluateComposition",
            new EvaluateCompositionRequest { Recipe = new Recipe { Name = "valid bytes", Components = { new RecipeComponent { ReagentId = "teos", Amount = new Amount { Value = 1, Unit = "mol" } } } } }.ToByteArray()));

        Assert.Equal(StatusCode.InvalidArgument, plan.StatusCode);
        Assert.Contains("CreatePlanRequest", plan.GetRpcStatus()!.GetDetail<BadRequest>().FieldViolations[0].Reason, StringComparison.Ordinal);
        Assert.Equal(StatusCode.InvalidArgument, watch.StatusCode);
        Assert.True(evaluated.OxideMassG > 0);
    }

    [Theory, SqliteEngine]
    public async Task Garbage_without_a_key_is_refused_as_unauthenticated_before_it_is_read(string engine)
    {
        var host = await hosts.ForAsync(engine);

        var refused = await Assert.ThrowsAsync<RpcException>(() => CallAsync(host, "PlanService", "CreatePlan", [0xFF, 0xFF], key: false));

        Assert.Equal(StatusCode.Unauthenticated, refused.StatusCode);
    }

    [Theory, SqliteEngine]
    public async Task The_duplex_reflection_service_bound_the_same_way_lists_every_service(string engine)
    {
        var host = await hosts.ForAsync(engine);
        using var call = new ServerReflection.ServerReflectionClient(host.Channel()).ServerReflectionInfo();

        await call.RequestStream.WriteAsync(new ServerReflectionRequest { ListServices = "" });
        await call.RequestStream.CompleteAsync();
        Assert.True(await call.ResponseStream.MoveNext(CancellationToken.None));

        var services = call.ResponseStream.Current.ListServicesResponse.Service.Select(s => s.Name).ToList();
        Assert.Contains("geldispense.v1.BatchService", services);
        Assert.Contains("geldispense.v1.PlanService", services);
        Assert.Contains("grpc.health.v1.Health", services);
    }

    private static Method<byte[], byte[]> Method(MethodType type, string service, string name) =>
        new(type, $"geldispense.v1.{service}", name, RawBytes, RawBytes);

    private static async Task<byte[]> CallAsync(ServiceHost host, string service, string name, byte[] body, bool key = true) =>
        await (key ? host.Channel() : host.Channel(null)).CreateCallInvoker()
            .AsyncUnaryCall(Method(MethodType.Unary, service, name), null, new CallOptions(), body).ResponseAsync;
}
