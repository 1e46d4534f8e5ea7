using BenchmarkDotNet.Attributes;

namespace Anneal.Benchmarks;

/// <summary>What the move benchmarks share: the three instances, one per evaluation path, and the fixture over each.</summary>
public abstract class KernelBenchmark
{
    [Params(KernelInstances.R101, KernelInstances.R1101, KernelInstances.R101Soft)]
    public string Instance { get; set; } = KernelInstances.R101;

    protected KernelFixture Fixture { get; private set; } = null!;

    [GlobalSetup]
    public void Setup()
    {
        Fixture = KernelFixture.Build(Instance);
        Prepare();
    }

    /// <summary>Anything a benchmark wants ready before timing starts, once the fixture exists.</summary>
    protected virtual void Prepare()
    {
    }
}
