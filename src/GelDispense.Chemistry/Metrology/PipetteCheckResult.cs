namespace GelDispense.Chemistry.Metrology;

/// <summary>
/// Outcome of a gravimetric pipette check at one selected volume (ISO 8655-6 quantities).
/// </summary>
/// <param name="PipetteId">The pipette checked.</param>
/// <param name="SelectedVolumeUl">Volume set on the pipette, V_s, µL.</param>
/// <param name="Count">Number of weighings, n.</param>
/// <param name="ZFactorUlPerMg">Mass-to-volume factor used, µL/mg.</param>
/// <param name="MeanVolumeUl">Mean delivered volume, V̄ = mean(m_i·Z), µL.</param>
/// <param name="SystematicErrorUl">e_s = V̄ − V_s, µL.</param>
/// <param name="SystematicErrorPct">100·e_s/V_s, %.</param>
/// <param name="RandomErrorUl">Sample standard deviation of the volumes, s_r, µL.</param>
/// <param name="RandomErrorCvPct">Coefficient of variation 100·s_r/V̄, %.</param>
/// <param name="SystematicMpeUl">The systematic limit applied, ± µL.</param>
/// <param name="RandomMpeUl">The random limit applied, µL.</param>
public sealed record PipetteCheckResult(
    string PipetteId,
    double SelectedVolumeUl,
    int Count,
    double ZFactorUlPerMg,
    double MeanVolumeUl,
    double SystematicErrorUl,
    double SystematicErrorPct,
    double RandomErrorUl,
    double RandomErrorCvPct,
    double SystematicMpeUl,
    double RandomMpeUl)
{
    /// <summary>|e_s| within the systematic MPE.</summary>
    public bool SystematicPass => Math.Abs(SystematicErrorUl) <= SystematicMpeUl;

    /// <summary>s_r within the random MPE.</summary>
    public bool RandomPass => RandomErrorUl <= RandomMpeUl;

    /// <summary>Both limits met.</summary>
    public bool Passed => SystematicPass && RandomPass;
}
