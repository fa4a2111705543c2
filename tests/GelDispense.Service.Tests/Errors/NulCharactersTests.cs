using GelDispense.Contracts.V1;
using GelDispense.Service.Errors;
using GelDispense.Service.Tests.Infrastructure;
using Google.Rpc;
using Grpc.Core;

namespace GelDispense.Service.Tests.Errors;

[Collection(ApiCollection.Name)]
public sealed class NulCharactersTests(ApiHosts hosts)
{
    [Fact]
    public void A_NUL_anywhere_in_a_request_is_found_with_its_path_nested_in_lists_and_maps()
    {
        var request = new CreatePlanRequest
        {
            Recipe = new Recipe
            {
                Name = "clean",
                Components =
                {
                    new RecipeComponent { ReagentId = "teos", Amount = new Amount { Value = 1, Unit = "mol" } },
                    new RecipeComponent { ReagentId = "et\0oh", Amount = new Amount { Value = 4, Unit = "m\0l" } },
                },
            },
            Options = new PlanOptions { StepLimitPctByReagent = { ["wa\0ter"] = 5 } },
        };

        var found = NulCharacters.Find(request);

        Assert.Equal(["recipe.components[1].reagentId", "recipe.components[1].amount.unit", "options.stepLimitPctByReagent[wa\0ter]"], found.Select(e => e.Field));
        Assert.Equal("et\\0oh", found[0].Value);
        Assert.All(found, e => Assert.Contains("U+0000", e.Reason, StringComparison.Ordinal));
    }

    [Fact]
    public void A_request_without_a_NUL_has_nothing_to_report() =>
        Assert.Empty(NulCharacters.Find(new RecordAdditionRequest { BatchId = "2026-1202-1", AdditionId = "a1", LotId = "L-7", ReadingG = 3.2, Stable = true }));

    [Theory, SqliteEngine, PostgresEngine]
    public async Task An_addition_id_with_a_NUL_is_refused_as_invalid_over_REST_and_gRPC_on_both_engines_and_nothing_is_recorded(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var client = host.CreateClient();
        var batchId = (string)(await Demo.StartBatchAsync(client, stationId: "bench-nul"))["id"]!;

        var rest = await Demo.PostAsync(client, $"/v1/batches/{batchId}/additions", """{"additionId":"n\u00001","stepIndex":0,"readingG":20.8,"stable":true}""", 400);
        var grpc = await Assert.ThrowsAsync<RpcException>(() => new BatchService.BatchServiceClient(host.Channel())
            .GetBatchAsync(new GetBatchRequest { Id = batchId + "\0" }).ResponseAsync);

        Assert.Equal("additionId", (string?)rest["errors"]?[0]?["field"]);
        Assert.Equal(StatusCode.InvalidArgument, grpc.StatusCode);
        Assert.Equal("id", grpc.GetRpcStatus()!.GetDetail<BadRequest>().FieldViolations[0].Field);
        var batch = await Demo.GetAsync(client, $"/v1/batches/{batchId}");
        Assert.Empty(batch["additions"]?.AsArray() ?? []);
    }
}
