using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Tolerances;

namespace GelDispense.Chemistry.Planning;

/// <summary>
/// Routing, device errors and windows of a formulation at one batch size. Routing and windows depend on
/// each other (a step goes to the pipette when the balance cannot hold its window), so the draft routes
/// against the caps, allocates, re-routes against the windows and allocates once more if anything moved.
/// </summary>
internal sealed class PlanDraft
{
    private PlanDraft(Formulation f, int[] order, double[] grossG, StepDevice[] devices, double[] windowsG, IReadOnlySet<int> doneLines)
    {
        DoneLines = doneLines;
        Formulation = f;
        Order = order;
        GrossG = grossG;
        Devices = devices;
        WindowsG = windowsG;
    }

    public Formulation Formulation { get; }

    /// <summary>Line indices in addition order: stage, then recipe order.</summary>
    public int[] Order { get; }

    public double[] GrossG { get; }

    public StepDevice[] Devices { get; }

    public double[] WindowsG { get; }

    /// <summary>Lines already added (in a re-plan): their masses are facts, not targets.</summary>
    public IReadOnlySet<int> DoneLines { get; }

    public bool StepFeasible(int line) =>
        Formulation.MassesG[line] == 0 || DoneLines.Contains(line) || (Devices[line].Usable && Devices[line].ErrorG <= WindowsG[line] * (1 + 1e-12));

    public bool Feasible => Order.All(StepFeasible);

    public static PlanDraft Compute(Formulation f, IReadOnlyList<SpecQuantity> quantities, PlanRequest request, IReadOnlySet<int>? doneLines = null)
    {
        doneLines ??= new HashSet<int>();
        var options = request.OptionsOrDefault;
        var lines = f.Lines;
        var masses = f.MassesG.ToArray();
        var order = lines.OrderBy(l => l.Stage).ThenBy(l => l.Index).Select(l => l.Index).ToArray();
        var gross = new double[masses.Length];
        var load = options.VesselTareG;
        foreach (var i in order)
        {
            load += masses[i];
            gross[i] = load;
        }

        var caps = lines.Select(l => doneLines.Contains(l.Index) ? 0 : options.StepLimitPct(l.ReagentId) / 100 * masses[l.Index]).ToArray();
        var devices = Route(f, request, gross, caps);
        var windows = ToleranceAllocator.Allocate(quantities, masses, Errors(devices), caps, options.Mode);
        var rerouted = Route(f, request, gross, windows);
        if (!rerouted.SequenceEqual(devices))
        {
            devices = rerouted;
            windows = ToleranceAllocator.Allocate(quantities, masses, Errors(devices), caps, options.Mode);
        }

        return new PlanDraft(f, order, gross, devices, windows, doneLines);
    }

    private static StepDevice[] Route(Formulation f, PlanRequest request, double[] grossG, double[] windowsG)
    {
        var options = request.OptionsOrDefault;
        return [.. f.Lines.Select(l =>
        {
            var m = f.MassesG[l.Index];
            var volumetric = options.VolumetricReagentIds.Contains(l.ReagentId, StringComparer.OrdinalIgnoreCase);
            var liquid = !l.Reagent.Definition.IsSolid;
            return m == 0
                ? new StepDevice(DispensingMethod.Balance, 0, true, null)
                : StepDevice.Choose(request, volumetric, liquid, m, grossG[l.Index], m * l.VolumeMlPerG, l.DensityGPerMl, windowsG[l.Index]);
        })];
    }

    /// <summary>Errors as allocation weights; an unusable device keeps a finite weight so the others still get theirs.</summary>
    private static double[] Errors(StepDevice[] devices) =>
        [.. devices.Select(d => double.IsFinite(d.ErrorG) ? d.ErrorG : 1.0)];
}
