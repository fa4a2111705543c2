using GelDispense.Agent.Formats;

namespace GelDispense.Agent.Stability;

/// <summary>
/// The judgement on one reading. <see cref="Confirmable"/> is the only gate for confirming an addition:
/// a stable mass reading. Drift is reported beside it, for the technician to see, not folded into it.
/// </summary>
public sealed record StabilityVerdict(BalanceReading Reading, bool IsStable, StabilityBasis Basis, DriftEstimate? Drift)
{
    public bool Confirmable => IsStable && Reading.Kind == ReadingKind.Weight && Reading.ValueG is not null;

    public bool Drifting => Drift?.Drifting == true;
}
