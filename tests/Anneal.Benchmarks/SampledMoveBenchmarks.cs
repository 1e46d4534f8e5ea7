using Anneal.Search.Moves;
using Anneal.Search.Representation;
using BenchmarkDotNet.Attributes;

namespace Anneal.Benchmarks;

/// <summary>
/// Drawing a move and judging it, as one annealing step does before acceptance (nothing is applied). One operation
/// is one draw; draws the sampler declines cost their sampling time and are not evaluated, as in the search.
/// </summary>
[MemoryDiagnoser]
public class SampledMoveBenchmarks
{
    public const int Draws = 4096;

    private SearchState _state = null!;
    private MoveSampler _sampler = null!;
    private MoveDraft _move;

    [Params(KernelInstances.R101, KernelInstances.R1101, KernelInstances.R101Soft)]
    public string Instance { get; set; } = KernelInstances.R101;

    [GlobalSetup]
    public void Setup()
    {
        var fixture = KernelFixture.Build(Instance);
        _state = fixture.State;
        _sampler = fixture.Sampler;
    }

    [Benchmark(OperationsPerInvoke = Draws)]
    public double SampleAndEvaluate()
    {
        var state = _state;
        var sampler = _sampler;
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
