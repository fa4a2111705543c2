namespace GelDispense.Chemistry.Planning;

/// <summary>
/// One addition. Masses are true masses; readings are what the balance shows (conventional mass against
/// 8.0 g/mL weights in the stated air). <see cref="ToleranceG"/> is the window on the true mass that the
/// spec allows; <see cref="AcceptanceG"/> is that window less the device's expected error, the band the
/// reading must fall in for the spec to be guaranteed (guard banding).
/// </summary>
public sealed record PlanStep
{
    public required int Index { get; init; }

    /// <summary>Index of the recipe component this step adds.</summary>
    public required int ComponentIndex { get; init; }

    public required string ReagentId { get; init; }

    public required int Stage { get; init; }

    public required DispensingMethod Method { get; init; }

    public required double TargetMassG { get; init; }

    public required double ToleranceG { get; init; }

    public required double DeviceErrorG { get; init; }

    public double AcceptanceG => Math.Max(0, ToleranceG - DeviceErrorG);

    public required double TargetReadingG { get; init; }

    /// <summary>Reading to stop at when the vessel is not re-tared (equals <see cref="TargetReadingG"/> after a re-tare).</summary>
    public required double CumulativeReadingG { get; init; }

    public required double TargetVolumeMl { get; init; }

    public required double DensityGPerMl { get; init; }

    public required bool Feasible { get; init; }

    public string? Problem { get; init; }

    public IReadOnlyList<string> Suggestions { get; init; } = [];

    public IReadOnlyList<string> Cautions { get; init; } = [];

    /// <summary>Information that does not make the step infeasible (for example the USP &lt;41&gt; minimum weight).</summary>
    public IReadOnlyList<string> Notes { get; init; } = [];

    /// <summary>In a re-plan: the step has been added and <see cref="TargetMassG"/> is the mass recorded.</summary>
    public bool Done { get; init; }

    /// <summary>For pipette steps, whether the balance can check the delivered volume from the mass.</summary>
    public bool BalanceVerifies { get; init; }
}
