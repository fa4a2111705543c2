using GelDispense.Chemistry.Planning;
using GelDispense.Service.Mapping;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Api;

/// <summary>Plans a recipe on a station's devices with the chemistry library's <see cref="PlanBuilder"/>, remembering plans already made.</summary>
public sealed class Planner(ReagentDirectory reagents, PlanMemo memo)
{
    public Task<Contract.DispensingPlan> PlanAsync(
        Contract.Recipe? recipe, Contract.BalanceProfile? balance, Contract.PipetteProfile? pipette, Contract.AirConditions? air,
        Contract.PlanOptions? options, CancellationToken cancellationToken) =>
        memo.GetOrPlanAsync(PlanMemo.Key(recipe, balance, pipette, air, options), async () =>
        {
            var chemistryRecipe = RecipeMapping.ToChemistry(recipe);
            var request = Request(balance, pipette, air, options);
            var catalog = await reagents.LookupAsync(chemistryRecipe, cancellationToken);
            return PlanMapping.ToContract(PlanBuilder.Build(chemistryRecipe, catalog, request), recipe!.Scale);
        });

    /// <summary>The station's devices, air and plan options as the library's plan request; bad values fail with their field names.</summary>
    public static PlanRequest Request(Contract.BalanceProfile? balance, Contract.PipetteProfile? pipette, Contract.AirConditions? air, Contract.PlanOptions? options) =>
        new(DeviceMapping.ToChemistry(balance, "balance"), DeviceMapping.ToChemistry(pipette, "pipette"), DeviceMapping.ToChemistry(air, "air"),
            PlanOptionsMapping.ToChemistry(options));
}
