using BenchmarkDotNet.Attributes;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Reagents;
using GelDispense.Chemistry.Solving;

namespace GelDispense.Benchmarks.Chemistry;

/// <summary>
/// The gravimetric plan for the 8 steps of <see cref="HybridSol"/>: routing, worst-case tolerance allocation
/// verified at the corners, capability and readings. <see cref="BuildFromRecipe"/> includes the spec solve,
/// as POST /v1/plans does; <see cref="BuildFromSolved"/> plans a formulation solved beforehand.
/// </summary>
[MemoryDiagnoser]
[MinColumn, MedianColumn]
public class PlanBenchmarks
{
    private ReagentCatalog _catalog = null!;
    private Formulation _solved = null!;

    [GlobalSetup]
    public void Setup()
    {
        _catalog = HybridSol.Catalog();
        _solved = SpecSolver.Solve(HybridSol.Recipe, _catalog).Formulation;
    }

    [Benchmark(Baseline = true)]
    public DispensingPlan BuildFromRecipe() => PlanBuilder.Build(HybridSol.Recipe, _catalog, HybridSol.Request);

    [Benchmark]
    public DispensingPlan BuildFromSolved() => PlanBuilder.Build(_solved, HybridSol.Request);
}
