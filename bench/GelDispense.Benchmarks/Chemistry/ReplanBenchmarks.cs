using BenchmarkDotNet.Attributes;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Replanning;

namespace GelDispense.Benchmarks.Chemistry;

/// <summary>
/// Re-planning <see cref="HybridSol"/> after TEOS went in 3 % over target and MTMS on target: the bounded
/// least-squares retarget of the six remaining steps, then their new windows.
/// </summary>
[MemoryDiagnoser]
[MinColumn, MedianColumn]
public class ReplanBenchmarks
{
    private DispensingPlan _plan = null!;
    private RecordedAddition[] _additions = null!;

    [GlobalSetup]
    public void Setup()
    {
        _plan = PlanBuilder.Build(HybridSol.Recipe, HybridSol.Catalog(), HybridSol.Request);
        _additions = HybridSol.OverPour(_plan);
    }

    [Benchmark]
    public ReplanResult Replan() => Replanner.Replan(_plan, _additions, HybridSol.Request);
}
