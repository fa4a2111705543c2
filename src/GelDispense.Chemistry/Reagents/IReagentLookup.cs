namespace GelDispense.Chemistry.Reagents;

/// <summary>Finds prepared reagents by id; ids compare without regard to case.</summary>
public interface IReagentLookup
{
    PreparedReagent? Find(string reagentId);
}
