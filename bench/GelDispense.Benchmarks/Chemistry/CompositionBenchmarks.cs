using BenchmarkDotNet.Attributes;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Reagents;

namespace GelDispense.Benchmarks.Chemistry;

/// <summary>
/// Recipe → composition for the 8-component <see cref="HybridSol"/>, with the catalog prepared once as a
/// service or agent holds it. <see cref="Evaluate"/> is the whole path; the other three split it into
/// resolving the recipe to masses, reporting on those masses, and the bare sums underneath.
/// </summary>
[MemoryDiagnoser]
[MinColumn, MedianColumn]
public class CompositionBenchmarks
{
    private ReagentCatalog _catalog = null!;
    private Formulation _formulation = null!;

    [GlobalSetup]
    public void Setup()
    {
        _catalog = HybridSol.Catalog();
        _formulation = Formulation.Prepare(HybridSol.Recipe, _catalog);
    }

    [Benchmark(Baseline = true)]
    public SolComposition Evaluate() => CompositionEvaluator.Evaluate(HybridSol.Recipe, _catalog);

    [Benchmark]
    public Formulation Prepare() => Formulation.Prepare(HybridSol.Recipe, _catalog);

    [Benchmark]
    public SolComposition Describe() => CompositionEvaluator.Describe(_formulation);

    [Benchmark]
    public CompositionTotals Totals() => _formulation.Totals();
}
