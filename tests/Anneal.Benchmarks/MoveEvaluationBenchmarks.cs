using Anneal.Search.Moves;
using Anneal.Search.Representation;
using BenchmarkDotNet.Attributes;

namespace Anneal.Benchmarks;

/// <summary>
/// SearchState.Evaluate on pre-drawn moves: the evaluation kernel alone. One operation is one move judged, so the
/// mean is nanoseconds per evaluation (10^9 / mean = evaluations per second) and the allocated column must read 0.
/// </summary>
[MemoryDiagnoser]
public class MoveEvaluationBenchmarks
{
    public const int Moves = 4096;

    private SearchState _state = null!;
    private MoveDraft[] _moves = [];

    [Params(KernelInstances.R101, KernelInstances.R1101, KernelInstances.R101Soft)]
    public string Instance { get; set; } = KernelInstances.R101;

    [GlobalSetup]
    public void Setup()
    {
        var fixture = KernelFixture.Build(Instance);
        _state = fixture.State;
        _moves = fixture.Draw(Moves);
    }

    [Benchmark(OperationsPerInvoke = Moves)]
    public double Evaluate()
    {
        var state = _state;
        var moves = _moves;
        double sink = 0;
        for (int k = 0; k < moves.Length; k++)
        {
            sink += state.Evaluate(ref moves[k]).Penalized;
        }

        return sink;
    }
}
