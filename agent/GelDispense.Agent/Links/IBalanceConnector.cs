namespace GelDispense.Agent.Links;

/// <summary>Opens connections of one kind (serial, TCP); throws with a readable reason when it cannot.</summary>
public interface IBalanceConnector
{
    string Describe { get; }

    IBalanceConnection Open();
}
