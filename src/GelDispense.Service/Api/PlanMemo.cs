using Google.Protobuf;
using Microsoft.Extensions.Caching.Memory;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Api;

/// <summary>
/// Remembers plans by the exact content of what they were planned from (recipe, balance, pipette, air, options), because a
/// station asks for the same plan again with every batch of a recipe. A plan is a pure function of that content and
/// of the reagent catalog, and the catalog only ever grows (custom reagents are never edited or removed, and a recipe
/// naming a missing reagent fails and is not remembered), so a remembered plan is the plan a fresh computation would
/// give, on every replica. Callers get their own copy.
/// </summary>
public sealed class PlanMemo : IDisposable
{
    /// <summary>Bytes kept (request and plan, as protobuf); beyond it the least recently used plans are dropped.</summary>
    public const long CapacityBytes = 32L * 1024 * 1024;

    private readonly MemoryCache _plans = new(new MemoryCacheOptions { SizeLimit = CapacityBytes });

    public static ByteString Key(
        Contract.Recipe? recipe, Contract.BalanceProfile? balance, Contract.PipetteProfile? pipette, Contract.AirConditions? air, Contract.PlanOptions? options) =>
        new Contract.CreatePlanRequest { Recipe = recipe, Balance = balance, Pipette = pipette, Air = air, Options = options }.ToByteString();

    public async Task<Contract.DispensingPlan> GetOrPlanAsync(ByteString key, Func<Task<Contract.DispensingPlan>> plan)
    {
        if (!_plans.TryGetValue(key, out Contract.DispensingPlan? remembered) || remembered is null)
        {
            remembered = await plan();
            _plans.Set(key, remembered, new MemoryCacheEntryOptions { Size = key.Length + remembered.CalculateSize() });
        }

        return remembered.Clone();
    }

    public void Dispose() => _plans.Dispose();
}
