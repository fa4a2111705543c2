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
public sealed class PlanMemo : IDisposable
{
    /// <summary>Bytes kept (request, plan and its serialised form, counted as protobuf); beyond it the least recently used plans are dropped.</summary>
    public const long CapacityBytes = 32L * 1024 * 1024;

    private readonly SerializedAnswers _serialized;
    private readonly MemoryCache _plans;

    public PlanMemo(SerializedAnswers serialized)
        : this(serialized, CapacityBytes)
    {
    }

    /// <summary>A memo of another size, for tests of what it drops.</summary>
    internal PlanMemo(SerializedAnswers serialized, long capacityBytes)
    {
        _serialized = serialized;
        _plans = new MemoryCache(new MemoryCacheOptions { SizeLimit = capacityBytes });
    }

    public static ByteString Key(
        Contract.Recipe? recipe, Contract.BalanceProfile? balance, Contract.PipetteProfile? pipette, Contract.AirConditions? air, Contract.PlanOptions? options) =>
        new Contract.CreatePlanRequest { Recipe = recipe, Balance = balance, Pipette = pipette, Air = air, Options = options }.ToByteString();

    /// <summary>The plan for <paramref name="key"/>, planned by <paramref name="plan"/> the first time; the caller's own copy.</summary>
    public async Task<Contract.DispensingPlan> GetOrPlanAsync(ByteString key, Func<Task<Contract.DispensingPlan>> plan) =>
        (await RememberedAsync(key, plan)).Plan.Clone();

    /// <summary>
    /// The remembered plan itself, for an answer that is sent as it is: no copy. From the second time a plan is asked
    /// for, its protobuf bytes are kept with it and gRPC writes it from them (<see cref="SerializedAnswers"/>); a plan
    /// asked for once, such as one at a new batch size, is not worth the bytes. The caller must not change it.
    /// </summary>
    public async Task<Contract.DispensingPlan> AnswerAsync(ByteString key, Func<Task<Contract.DispensingPlan>> plan)
    {
        var (remembered, again) = await RememberedAsync(key, plan);
        if (again && !_serialized.TryGet(remembered, out _))
        {
            _serialized.Keep(remembered);
            // Dropped meanwhile, and perhaps already forgotten by its eviction callback: bytes must not outlive their plan here.
            if (!_plans.TryGetValue(key, out Contract.DispensingPlan? still) || !ReferenceEquals(still, remembered))
            {
                _serialized.Forget(remembered);
            }
        }

        return remembered;
    }

    private async Task<(Contract.DispensingPlan Plan, bool Again)> RememberedAsync(ByteString key, Func<Task<Contract.DispensingPlan>> plan)
    {
        if (_plans.TryGetValue(key, out Contract.DispensingPlan? remembered) && remembered is not null)
        {
            return (remembered, true);
        }

        remembered = await plan();
        // Sized with room for the bytes it may keep, so that keeping them never pushes the memo past its capacity.
        var entry = new MemoryCacheEntryOptions { Size = key.Length + 2L * remembered.CalculateSize() };
        entry.RegisterPostEvictionCallback(static (_, plan, _, answers) => ((SerializedAnswers)answers!).Forget(plan!), _serialized);
        _plans.Set(key, remembered, entry);
        return (remembered, false);
    }

    public void Dispose() => _plans.Dispose();
}
