using Anneal.Search.Moves;
using BenchmarkDotNet.Attributes;

namespace Anneal.Benchmarks;

/// <summary>
/// SearchState.Evaluate on pre-drawn moves: the evaluation kernel alone. One operation is one move judged, so the
/// mean is nanoseconds per evaluation (10^9 / mean = evaluations per second) and the allocated column must read 0.
/// </summary>
[MemoryDiagnoser]
public class MoveEvaluationBenchmarks : KernelBenchmark
{
    public const int Moves = 4096;

    private MoveDraft[] _moves = [];

    protected override void Prepare() => _moves = Fixture.Draw(Moves);

    [Benchmark(OperationsPerInvoke = Moves)]
    public double Evaluate()
    {
        var state = Fixture.State;
        var moves = _moves;
        double sink = 0;
        for (int k = 0; k < moves.Length; k++)
        {
            sink += state.Evaluate(ref moves[k]).Penalized;
        }

        return sink;
    }
}
