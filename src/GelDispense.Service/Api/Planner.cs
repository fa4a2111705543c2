using GelDispense.Chemistry.Planning;
using GelDispense.Service.Mapping;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Api;

/// <summary>Plans a recipe on a station's devices with the chemistry library's <see cref="PlanBuilder"/>, remembering plans already made.</summary>
public sealed class Planner(ReagentDirectory reagents, PlanMemo memo)
{
    /// <summary>The plan, the caller's own copy to build on.</summary>
    public Task<Contract.DispensingPlan> PlanAsync(
        Contract.Recipe? recipe, Contract.BalanceProfile? balance, Contract.PipetteProfile? pipette, Contract.AirConditions? air,
        Contract.PlanOptions? options, CancellationToken cancellationToken) =>
        memo.GetOrPlanAsync(PlanMemo.Key(recipe, balance, pipette, air, options), () => BuildAsync(recipe, balance, pipette, air, options, cancellationToken));

    /// <summary>The plan to send as the answer as it is: the remembered plan itself, which the caller must not change (see <see cref="PlanMemo.AnswerAsync"/>).</summary>
    public Task<Contract.DispensingPlan> AnswerAsync(
        Contract.Recipe? recipe, Contract.BalanceProfile? balance, Contract.PipetteProfile? pipette, Contract.AirConditions? air,
        Contract.PlanOptions? options, CancellationToken cancellationToken) =>
        memo.AnswerAsync(PlanMemo.Key(recipe, balance, pipette, air, options), () => BuildAsync(recipe, balance, pipette, air, options, cancellationToken));

    private async Task<Contract.DispensingPlan> BuildAsync(
        Contract.Recipe? recipe, Contract.BalanceProfile? balance, Contract.PipetteProfile? pipette, Contract.AirConditions? air,
        Contract.PlanOptions? options, CancellationToken cancellationToken)
    {
        var chemistryRecipe = RecipeMapping.ToChemistry(recipe);
        var request = Request(balance, pipette, air, options);
        var catalog = await reagents.LookupAsync(chemistryRecipe, cancellationToken);
        return PlanMapping.ToContract(PlanBuilder.Build(chemistryRecipe, catalog, request), recipe!.Scale);
    }

    /// <summary>The station's devices, air and plan options as the library's plan request; bad values fail with their field names.</summary>
    public static PlanRequest Request(Contract.BalanceProfile? balance, Contract.PipetteProfile? pipette, Contract.AirConditions? air, Contract.PlanOptions? options) =>
        new(DeviceMapping.ToChemistry(balance, "balance"), DeviceMapping.ToChemistry(pipette, "pipette"), DeviceMapping.ToChemistry(air, "air"),
            PlanOptionsMapping.ToChemistry(options));
}
