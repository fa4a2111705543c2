using GelDispense.Contracts.V1;
using GelDispense.Service.Api;
using GelDispense.Service.Extensions;
using GelDispense.Service.Security;
using GelDispense.Service.Tests.Infrastructure;
using Google.Protobuf;
using Google.Rpc;
using Grpc.Core;
using Grpc.Reflection.V1Alpha;
using Microsoft.Extensions.DependencyInjection;

namespace GelDispense.Service.Tests.Extensions;

/// <summary>
/// gRPC requests whose bytes are not the message the method takes, sent as a client with a broken encoder would; and
/// answers written from the bytes kept for them.
/// </summary>
[Collection(ApiCollection.Name)]
public sealed class ServiceMethodBindingTests(ApiHosts hosts)
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

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Seeded_byte_mutations_of_valid_requests_never_get_unknown_or_internal_and_every_invalid_argument_names_a_reason(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var batch = await new BatchService.BatchServiceClient(host.Channel()).CreateBatchAsync(Corrections.CreateRequest("bench-gfuzz"));
        var valid = new (string Service, string Method, IMessage Request)[]
        {
            ("PlanService", "CreatePlan", JsonParser.Default.Parse<CreatePlanRequest>($$"""{"recipe":{{Demo.DensityRecipe}},"balance":{{Demo.Balance}}}""")),
            ("CompositionService", "EvaluateComposition", JsonParser.Default.Parse<EvaluateCompositionRequest>($$"""{"recipe":{{Demo.DensityRecipe}}}""")),
            ("BatchService", "CreateBatch", Corrections.CreateRequest("bench-gfuzz")),
            ("BatchService", "RecordAddition", Corrections.Add(batch, "gf1", 0, batch.Steps[0].TargetReadingG)),
            ("ReagentService", "CreateReagent", JsonParser.Default.Parse<CreateReagentRequest>(
                """{"reagent":{"id":"ipa-gfuzz","name":"2-propanol","formula":"C3H8O","densityGPerMl":0.7855,"role":"solvent"}}""")),
        };
        var random = new Random(2718);
        foreach (var (service, method, request) in valid)
        {
            // A key of its own per method: 120 calls stay inside one key's burst, and the shared admin key's bucket is left alone.
            var channel = host.Channel(await host.IssueKeyAsync(Roles.Admin));
            var bytes = request.ToByteArray();
            for (var trial = 0; trial < 120; trial++)
            {
                var mutated = trial % 10 == 9 ? bytes[..random.Next(bytes.Length)] : (byte[])bytes.Clone();
                for (var flips = trial % 10 == 9 ? 0 : random.Next(1, 4); flips > 0; flips--)
                {
                    mutated[random.Next(mutated.Length)] = (byte)random.Next(256);
                }

                var status = StatusCode.OK;
                var reason = "";
                try
                {
                    await channel.CreateCallInvoker().AsyncUnaryCall(Method(MethodType.Unary, service, method), null, new CallOptions(), mutated).ResponseAsync;
                }
                catch (RpcException e)
                {
                    status = e.StatusCode;
                    reason = e.GetRpcStatus()?.GetDetail<BadRequest>()?.FieldViolations.FirstOrDefault()?.Reason ?? "";
                }

                var what = $"{service}/{method} with {Convert.ToHexString(mutated)[..Math.Min(80, mutated.Length * 2)]}…";
                Assert.True(status is not (StatusCode.Unknown or StatusCode.Internal or StatusCode.DataLoss or StatusCode.Unimplemented or StatusCode.ResourceExhausted),
                    $"{what} gave {status}");
                Assert.True(status != StatusCode.InvalidArgument || reason.Length > 0, $"{what} gave INVALID_ARGUMENT without a reason");
            }
        }
    }

    [Fact]
    public void An_answer_with_kept_bytes_is_written_from_that_very_array_and_any_other_is_serialised_as_before()
    {
        var serialized = new SerializedAnswers();
        var remembered = new DispensingPlan { Feasible = true, Steps = { new PlanStep { Index = 0, ReagentId = "teos", TargetMassG = 20.83 } } };
        var kept = serialized.Keep(remembered);
        var marshaller = ServiceMethodBinding.FromKeptBytes(Marshallers.Create(p => p.ToByteArray(), DispensingPlan.Parser.ParseFrom), serialized);

        var fromKept = new RecordedPayload();
        marshaller.ContextualSerializer(remembered, fromKept);
        var copy = new RecordedPayload();
        marshaller.ContextualSerializer(remembered.Clone(), copy);

        Assert.Same(kept, fromKept.Bytes);
        Assert.NotSame(kept, copy.Bytes);
        Assert.Equal(kept, copy.Bytes);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_plan_made_over_rest_and_repeated_over_grpc_is_written_from_its_kept_bytes_and_never_changes(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var request = JsonParser.Default.Parse<CreatePlanRequest>($$"""{"recipe":{{Demo.DensityRecipe}},"balance":{{Demo.Balance}}}""");
        request.Recipe.Name = $"kept-bytes-{engine}";

        var overRest = await Demo.PostAsync(host.CreateClient(), "/v1/plans", JsonFormatter.Default.Format(request));
        var first = await CallAsync(host, "PlanService", "CreatePlan", request.ToByteArray());
        var second = await CallAsync(host, "PlanService", "CreatePlan", request.ToByteArray());

        var remembered = await host.Services.GetRequiredService<PlanMemo>().AnswerAsync(
            PlanMemo.Key(request.Recipe, request.Balance, request.Pipette, request.Air, request.Options),
            () => throw new InvalidOperationException("the plan was not remembered"));
        Assert.True(host.Services.GetRequiredService<SerializedAnswers>().TryGet(remembered, out var kept));
        Assert.Equal(kept, second);
        Assert.Equal(first, second);
        // Written as JSON, then sent twice over gRPC: the shared plan is still exactly what its kept bytes say.
        Assert.Equal(remembered.ToByteArray(), kept);
        Assert.Equal(JsonParser.Default.Parse<DispensingPlan>(overRest.ToJsonString()), DispensingPlan.Parser.ParseFrom(second));
        Assert.NotEmpty(remembered.Steps);
    }

    private static Method<byte[], byte[]> Method(MethodType type, string service, string name) =>
        new(type, $"geldispense.v1.{service}", name, RawBytes, RawBytes);

    private static async Task<byte[]> CallAsync(ServiceHost host, string service, string name, byte[] body, bool key = true) =>
        await (key ? host.Channel() : host.Channel(null)).CreateCallInvoker()
            .AsyncUnaryCall(Method(MethodType.Unary, service, name), null, new CallOptions(), body).ResponseAsync;

    /// <summary>What a marshaller hands to the transport.</summary>
    private sealed class RecordedPayload : SerializationContext
    {
        public byte[]? Bytes { get; private set; }

        public override void Complete(byte[] payload) => Bytes = payload;
    }
}
