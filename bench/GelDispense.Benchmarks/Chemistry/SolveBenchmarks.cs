using BenchmarkDotNet.Attributes;
using GelDispense.Chemistry.Reagents;
using GelDispense.Chemistry.Solving;

namespace GelDispense.Benchmarks.Chemistry;

/// <summary>
/// Solving the <see cref="HybridSol"/> spec (R and oxide density, with ethanol and methanol as the free
/// solvent pair) and scaling to the 250 mL batch; the result carries the full composition.
/// </summary>
[MemoryDiagnoser]
[MinColumn, MedianColumn]
public class SolveBenchmarks
{
    private ReagentCatalog _catalog = null!;

    [GlobalSetup]
    public void Setup() => _catalog = HybridSol.Catalog();

    [Benchmark]
    public SolvedRecipe Solve() => SpecSolver.Solve(HybridSol.Recipe, _catalog);
}
