namespace GelDispense.Agent.Stability;

/// <summary>
/// The trend over the drift window: slope in g/min (negative when mass is lost, e.g. an evaporating solvent),
/// the share of variance the straight line explains, and whether that counts as drifting.
/// </summary>
public sealed record DriftEstimate(double SlopeGPerMin, double RSquared, int Readings, bool Drifting);
