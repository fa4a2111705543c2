using GelDispense.Agent.Formats;

namespace GelDispense.Agent.Simulation;

/// <summary>What the simulated balance shows at one sample: a quantised mass (grams) with its own stability
/// flag, or a marker; plus whether noise is to be spliced into this line.</summary>
public sealed record SimulatedSample(TimeSpan At, ReadingKind Kind, double DisplayedG, bool Stable, bool Garbled);
