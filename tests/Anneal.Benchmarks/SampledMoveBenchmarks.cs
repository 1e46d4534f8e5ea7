using Anneal.Search.Moves;
using BenchmarkDotNet.Attributes;

namespace Anneal.Benchmarks;

/// <summary>
/// Drawing a move and judging it, as one annealing step does before acceptance (nothing is applied). One operation
/// is one draw; draws the sampler declines cost their sampling time and are not evaluated, as in the search.
/// </summary>
[MemoryDiagnoser]
public class SampledMoveBenchmarks : KernelBenchmark
{
    public const int Draws = 4096;

    private MoveDraft _move;

    [Benchmark(OperationsPerInvoke = Draws)]
    public double SampleAndEvaluate()
    {
        var state = Fixture.State;
        var sampler = Fixture.Sampler;
        double sink = 0;
        for (int k = 0; k < Draws; k++)
        {
            if (sampler.Next(ref _move))
            {
                sink += state.Evaluate(ref _move).Penalized;
            }
        }

        return sink;
    }
}
