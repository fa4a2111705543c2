using GelDispense.Chemistry.Composition;
using GelDispense.Contracts.V1;
using GelDispense.Service.Mapping;
using Grpc.Core;
using GelDispense.Service.Security;
using Microsoft.AspNetCore.Authorization;

namespace GelDispense.Service.Api;

/// <summary>POST /v1/compositions:evaluate — the chemistry library's composition evaluator behind the contract.</summary>
[Authorize(Policy = Policies.Design)]
public sealed class CompositionApi(ReagentDirectory reagents) : CompositionService.CompositionServiceBase
{
    public override async Task<Contracts.V1.Composition> EvaluateComposition(EvaluateCompositionRequest request, ServerCallContext context)
    {
        var recipe = RecipeMapping.ToChemistry(request.Recipe);
        var catalog = await reagents.LookupAsync(recipe, context.CancellationToken);
        return CompositionMapping.ToContract(CompositionEvaluator.Evaluate(recipe, catalog));
    }
}
