using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Station;

/// <summary>How a run ended: every step made or stopped early, the batch completed at the service or not, what still
/// waits in the journal, and the as-made record shown (null when none could be computed).</summary>
public sealed record RunResult(string BatchId, bool AllStepsMade, bool Completed, int PendingAdditions, AsMade? AsMade, IReadOnlyList<Sequencing.MadeAddition> Additions);
