using GelDispense.Contracts.V1;
using GelDispense.Service.Tests.Infrastructure;
using Google.Rpc;
using Grpc.Core;

namespace GelDispense.Service.Tests.Batches;

/// <summary>Bad correction requests through the real service: each refusal names the field, the value and why, and writes nothing.</summary>
[Collection(ApiCollection.Name)]
public sealed class CorrectionInputTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_blank_reason_and_a_negative_reading_are_400_naming_field_value_and_reason_over_REST(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var (batch, path) = await StartAsync(host, "bench-corr-in-1");

        var problem = await Demo.PostAsync(host.CreateClient(), path, Corrections.Body("v1", -1.5, "   "), 400);
        var errors = problem["errors"]!.AsArray().ToDictionary(e => (string)e!["field"]!);
        Assert.Equal("-1.5", (string)errors["readingG"]!["value"]!);
        Assert.Contains("zero or more grams", (string)errors["readingG"]!["reason"]!, StringComparison.Ordinal);
        Assert.Equal("   ", (string)errors["reason"]!["value"]!);
        Assert.Contains("say why", (string)errors["reason"]!["reason"]!, StringComparison.Ordinal);

        var infinite = await Demo.PostAsync(host.CreateClient(), path, """{"correctionId":"v2","readingG":"Infinity","reason":"x"}""", 400);
        Assert.Equal(("readingG", "Infinity"), ((string)infinite["errors"]![0]!["field"]!, (string)infinite["errors"]![0]!["value"]!));
        var tooLong = await Demo.PostAsync(host.CreateClient(), path, Corrections.Body("v3", 20.0, new string('r', 501)), 400);
        Assert.Equal("reason", (string)tooLong["errors"]![0]!["field"]!);
        await AssertNothingWrittenAsync(host, batch);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task A_NaN_reading_and_a_blank_correction_id_are_INVALID_ARGUMENT_with_field_violations_over_gRPC(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var (batch, _) = await StartAsync(host, "bench-corr-in-2");
        var grpc = Corrections.Client(host, host.AdminKey);

        var error = await Assert.ThrowsAsync<RpcException>(() => grpc.CorrectAdditionAsync(Corrections.Correct(batch, "i1", " ", double.NaN, "recheck")).ResponseAsync);

        Assert.Equal(StatusCode.InvalidArgument, error.StatusCode);
        var violations = error.GetRpcStatus()!.GetDetail<BadRequest>().FieldViolations.ToDictionary(v => v.Field);
        Assert.Contains("(value: 'NaN')", violations["readingG"].Description, StringComparison.Ordinal);
        Assert.Contains("finite", violations["readingG"].Reason, StringComparison.Ordinal);
        Assert.Contains("1 to 64 characters", violations["correctionId"].Reason, StringComparison.Ordinal);
        Assert.Equal(2, violations.Count);
        await AssertNothingWrittenAsync(host, batch);
    }

    private static async Task<(Batch Batch, string Path)> StartAsync(ServiceHost host, string stationId)
    {
        var grpc = Corrections.Client(host, host.AdminKey);
        var batch = await grpc.CreateBatchAsync(Corrections.CreateRequest(stationId));
        await grpc.RecordAdditionAsync(Corrections.Add(batch, "i1", 0, batch.Steps[0].TargetReadingG));
        return (await grpc.GetBatchAsync(new GetBatchRequest { Id = batch.Id }), Corrections.Path(batch.Id, "i1"));
    }

    private static async Task AssertNothingWrittenAsync(ServiceHost host, Batch before)
    {
        var after = await Corrections.Client(host, host.AdminKey).GetBatchAsync(new GetBatchRequest { Id = before.Id });
        Assert.Equal((before.Version, before.LastEventSequence, 0), (after.Version, after.LastEventSequence, after.Additions[0].CorrectionCount));
    }
}
