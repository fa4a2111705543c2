using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Reagents;
using GelDispense.Service.Mapping;
using GelDispense.Service.Storage;
using Google.Protobuf;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Api;

/// <summary>
/// The catalog a request computes with: the built-in reagents (prepared once per process) and the custom ones
/// stored in the database (read per request, so every replica sees a reagent as soon as it is stored).
/// </summary>
public sealed class ReagentDirectory(ReagentStore store)
{
    private readonly ReagentCatalog _builtIn = BuiltInReagents.CreateCatalog();

    public bool IsBuiltIn(string id) => _builtIn.Find(id) is not null;

    public IEnumerable<Reagent> BuiltIn => BuiltInReagents.All;

    /// <summary>
    /// The catalog for one recipe. Only the custom reagents the recipe names are read, and none at all when it
    /// names only built-in and inline reagents, so most requests do not touch the database here.
    /// </summary>
    public async Task<IReagentLookup> LookupAsync(Recipe recipe, CancellationToken cancellationToken)
    {
        var stored = recipe.Components.Select(c => c.ReagentId?.ToLowerInvariant())
            .Where(id => id is not null && !IsBuiltIn(id) && !recipe.InlineReagents.Any(r => string.Equals(r.Id, id, StringComparison.OrdinalIgnoreCase)))
            .OfType<string>().Distinct().ToArray();
        if (stored.Length == 0)
        {
            return _builtIn;
        }

        var custom = (await store.ReagentBodiesAsync(stored, cancellationToken)).Select(FromJson).ToArray();
        return custom.Length == 0
            ? _builtIn
            : new LayeredReagentLookup([.. custom.Select(r => PreparedReagent.Prepare(r, $"reagent '{r.Id}'"))], _builtIn);
    }

    public async Task<IReadOnlyList<Reagent>> CustomAsync(CancellationToken cancellationToken)
    {
        var bodies = await store.ReagentBodiesAsync(cancellationToken);
        return [.. bodies.Select(FromJson)];
    }

    public async Task<Reagent?> FindAsync(string id, CancellationToken cancellationToken)
    {
        if (_builtIn.Find(id) is { } builtIn)
        {
            return builtIn.Definition;
        }

        var body = await store.ReagentBodyAsync(id.ToLowerInvariant(), cancellationToken);
        return body is null ? null : FromJson(body);
    }

    private static Reagent FromJson(string body)
    {
        var errors = new List<InputError>();
        var reagent = ReagentMapping.ToChemistry(JsonParser.Default.Parse<Contract.Reagent>(body), "stored reagent", errors);
        return reagent is not null && errors.Count == 0
            ? reagent
            : throw new InvalidOperationException($"A stored reagent no longer maps: {string.Join("; ", errors)}");
    }
}
