namespace GelDispense.Chemistry.Reagents;

/// <summary>
/// A set of prepared reagents keyed by id (case-insensitive). Preparing happens once, on <see cref="Add"/>,
/// so lookups on the evaluation path allocate nothing.
/// </summary>
public sealed class ReagentCatalog : IReagentLookup
{
    private readonly Dictionary<string, PreparedReagent> _byId = new(StringComparer.OrdinalIgnoreCase);

    public ReagentCatalog(IEnumerable<Reagent>? reagents = null)
    {
        foreach (var reagent in reagents ?? [])
        {
            Add(reagent);
        }
    }

    public IEnumerable<PreparedReagent> All => _byId.Values.OrderBy(r => r.Id, StringComparer.Ordinal);

    /// <summary>Adds or replaces a reagent; throws <see cref="Errors.InvalidInputException"/> when it does not validate.</summary>
    public PreparedReagent Add(Reagent reagent, string field = "reagent")
    {
        var prepared = PreparedReagent.Prepare(reagent, field);
        _byId[reagent.Id] = prepared;
        return prepared;
    }

    public PreparedReagent? Find(string reagentId) => _byId.GetValueOrDefault(reagentId);
}
