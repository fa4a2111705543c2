namespace GelDispense.Chemistry.Reagents;

/// <summary>Sees a recipe's inline reagents first, then the catalog, so a recipe can override a catalog entry for itself only.</summary>
public sealed class LayeredReagentLookup(IReadOnlyList<PreparedReagent> inline, IReagentLookup fallback) : IReagentLookup
{
    public PreparedReagent? Find(string reagentId)
    {
        foreach (var r in inline)
        {
            if (string.Equals(r.Id, reagentId, StringComparison.OrdinalIgnoreCase))
            {
                return r;
            }
        }

        return fallback.Find(reagentId);
    }
}
