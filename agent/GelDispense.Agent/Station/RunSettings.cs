using GelDispense.Agent.Sequencing;

namespace GelDispense.Agent.Station;

/// <summary>
/// How the station runs a batch: confirmation mode and zeroing, the balance's tare command (none built in), the lot
/// of each reagent (by reagent id), and the source written with each addition.
/// </summary>
public sealed record RunSettings
{
    public StepMachineSettings Machine { get; init; } = new();

    /// <summary>The text that tares the balance; null means a software tare (the step counts from the pan as it is).</summary>
    public string? TareCommand { get; init; }

    public IReadOnlyDictionary<string, string> Lots { get; init; } = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);

    public string Source { get; init; } = "balance";

    /// <summary>Mark the batch completed at the service when every step is recorded there.</summary>
    public bool CompleteAtEnd { get; init; } = true;

    public double ReadabilityG { get; init; } = 0.0001;

    /// <summary>How often time-driven work runs: display refresh, tare repeats, replay attempts.</summary>
    public TimeSpan Tick { get; init; } = TimeSpan.FromMilliseconds(250);

    public string LotOf(string reagentId) => Lots.TryGetValue(reagentId, out var lot) ? lot : "";
}
