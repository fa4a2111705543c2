using Google.Protobuf;
using Microsoft.Extensions.Caching.Memory;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Api;

/// <summary>
/// Remembers plans by the exact content of what they were planned from (recipe, balance, pipette, air, options), because a
/// station asks for the same plan again with every batch of a recipe. A plan is a pure function of that content and
/// of the reagent catalog, and the catalog only ever grows (custom reagents are never edited or removed, and a recipe
/// naming a missing reagent fails and is not remembered), so a remembered plan is the plan a fresh computation would
/// give, on every replica. Callers get their own copy, except an answer sent as is (<see cref="AnswerAsync"/>), which
/// is the remembered plan itself, written out from the bytes kept with it.
/// </summary>
public sealed class PlanMemo(SerializedAnswers serialized) : IDisposable
{
    /// <summary>Bytes kept (request, plan and its serialised form, counted as protobuf); beyond it the least recently used plans are dropped.</summary>
    public const long CapacityBytes = 32L * 1024 * 1024;

    private readonly MemoryCache _plans = new(new MemoryCacheOptions { SizeLimit = CapacityBytes });

    public static ByteString Key(
        Contract.Recipe? recipe, Contract.BalanceProfile? balance, Contract.PipetteProfile? pipette, Contract.AirConditions? air, Contract.PlanOptions? options) =>
        new Contract.CreatePlanRequest { Recipe = recipe, Balance = balance, Pipette = pipette, Air = air, Options = options }.ToByteString();

    /// <summary>The plan for <paramref name="key"/>, planned by <paramref name="plan"/> the first time; the caller's own copy.</summary>
    public async Task<Contract.DispensingPlan> GetOrPlanAsync(ByteString key, Func<Task<Contract.DispensingPlan>> plan) =>
        (await RememberedAsync(key, plan)).Clone();

    /// <summary>
    /// The remembered plan itself, for an answer that is sent as it is: no copy, and gRPC writes it from the bytes kept
    /// with it (<see cref="SerializedAnswers"/>). The caller must not change it.
    /// </summary>
    public Task<Contract.DispensingPlan> AnswerAsync(ByteString key, Func<Task<Contract.DispensingPlan>> plan) => RememberedAsync(key, plan);

    private async Task<Contract.DispensingPlan> RememberedAsync(ByteString key, Func<Task<Contract.DispensingPlan>> plan)
    {
        if (!_plans.TryGetValue(key, out Contract.DispensingPlan? remembered) || remembered is null)
        {
            remembered = await plan();
            var bytes = serialized.Keep(remembered);
            _plans.Set(key, remembered, new MemoryCacheEntryOptions { Size = key.Length + 2L * bytes.Length });
        }

        return remembered;
    }

    public void Dispose() => _plans.Dispose();
}
