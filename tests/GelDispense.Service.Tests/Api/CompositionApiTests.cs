using GelDispense.Contracts.V1;
using GelDispense.Service.Tests.Infrastructure;
using Google.Rpc;
using Grpc.Core;

namespace GelDispense.Service.Tests.Api;

[Collection(ApiCollection.Name)]
public sealed class CompositionApiTests(ApiHosts hosts)
{
    [Theory, SqliteEngine, PostgresEngine]
    public async Task Evaluating_the_demo_recipe_over_REST_gives_R_4_and_the_silica_mass(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var composition = await Demo.PostAsync(host.CreateClient(), "/v1/compositions:evaluate", $$"""{"recipe":{{Demo.Recipe}}}""");

        // R = mol water / mol TEOS = 4 / 1 by construction of the ratios.
        Assert.Equal(4.0, (double)composition["hydrolysisRatio"]!, 9);
        // SiO2 = 28.085 + 2 × 15.999 = 60.083 g/mol (IUPAC conventional atomic weights), 0.1 mol of it.
        Assert.Equal(6.0083, (double)composition["oxideMassG"]!, 4);
        Assert.Contains(composition["cautions"]!.AsArray(), c => ((string)c!).StartsWith("H225", StringComparison.Ordinal));
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task Evaluating_over_gRPC_gives_the_same_composition_as_REST(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var rest = await Demo.PostAsync(host.CreateClient(), "/v1/compositions:evaluate", $$"""{"recipe":{{Demo.Recipe}}}""");
        var client = new CompositionService.CompositionServiceClient(host.Channel());

        var grpc = await client.EvaluateCompositionAsync(new EvaluateCompositionRequest
        {
            Recipe = Google.Protobuf.JsonParser.Default.Parse<Recipe>(Demo.Recipe),
        });

        Assert.Equal((double)rest["gelVolumeMl"]!, grpc.GelVolumeMl, 12);
        Assert.Equal((double)rest["hydrolysisRatio"]!, grpc.HydrolysisRatio, 12);
        Assert.Equal(3, grpc.Components.Count);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task An_unknown_unit_is_a_400_naming_field_value_and_reason(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var recipe = Demo.Recipe.Replace("{\"value\":1,\"unit\":\"ratio\"}", "{\"value\":1,\"unit\":\"gallon\"}", StringComparison.Ordinal);

        var problem = await Demo.PostAsync(host.CreateClient(), "/v1/compositions:evaluate", $$"""{"recipe":{{recipe}}}""", 400);

        var error = problem["errors"]![0]!;
        Assert.Equal("recipe.components[0].amount.unit", (string)error["field"]!);
        Assert.Equal("gallon", (string)error["value"]!);
        Assert.Contains("unknown unit", (string)error["reason"]!, StringComparison.Ordinal);
    }

    [Theory, SqliteEngine, PostgresEngine]
    public async Task An_unknown_reagent_over_gRPC_is_INVALID_ARGUMENT_with_a_field_violation(string engine)
    {
        var host = await hosts.ForAsync(engine);
        var recipe = Google.Protobuf.JsonParser.Default.Parse<Recipe>(Demo.Recipe);
        recipe.Components[1].ReagentId = "unobtainium";
        var client = new CompositionService.CompositionServiceClient(host.Channel());

        var error = await Assert.ThrowsAsync<RpcException>(() => client.EvaluateCompositionAsync(new EvaluateCompositionRequest { Recipe = recipe }).ResponseAsync);

        Assert.Equal(StatusCode.InvalidArgument, error.StatusCode);
        var badRequest = error.GetRpcStatus()!.GetDetail<BadRequest>();
        Assert.Contains(badRequest.FieldViolations, v => v.Field == "recipe.components[1].reagentId" && v.Description.Contains("unobtainium", StringComparison.Ordinal));
    }
}
