namespace GelDispense.Agent.Tests.Support;

/// <summary>
/// Tests that run a whole station (service, simulated balance, agent loop) take turns: on a two-core machine, several
/// at once would starve the simulator's clock and the balance's settling, which these tests time against.
/// </summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class StationCollection
{
    public const string Name = "whole station";
}
