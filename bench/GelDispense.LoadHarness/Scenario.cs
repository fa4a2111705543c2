namespace GelDispense.LoadHarness;

/// <summary>One call shape to measure: its name in the table, the protocol, how many clients, and how to make a client.</summary>
public sealed record Scenario(string Name, string Protocol, int Clients, Func<int, ILoadClient> NewClient);
