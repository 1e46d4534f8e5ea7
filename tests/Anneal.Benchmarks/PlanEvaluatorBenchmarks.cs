using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Anneal.Search.Construction;
using Anneal.Search.Neighbourhoods;
using BenchmarkDotNet.Attributes;

namespace Anneal.Benchmarks;

/// <summary>
/// The exact evaluator on a whole plan (the construction plan of r101), for scale against one move evaluation:
/// it schedules every route and builds the full report, so it allocates by design.
/// </summary>
[MemoryDiagnoser]
public class PlanEvaluatorBenchmarks
{
    private Instance _instance = null!;
    private Plan _plan = null!;

    [GlobalSetup]
    public void Setup()
    {
        _instance = KernelInstances.Load(KernelInstances.R101);
        _plan = InsertionSolver.Build(_instance, new CandidateLists(_instance, KernelFixture.CandidateCount)).ToPlan();
    }

    [Benchmark]
    public PlanEvaluation Evaluate() => PlanEvaluator.Evaluate(_instance, _plan);
}
