using Anneal.Core.Model;
using Anneal.Formats.Input;

namespace Anneal.Benchmarks;

/// <summary>The instances the kernel benchmarks run on, by the short names used as benchmark parameters.</summary>
public static class KernelInstances
{
    /// <summary>Solomon r101: 100 stops, dense matrix, hard windows, so moves take the segment-concatenation path.</summary>
    public const string R101 = "r101";

    /// <summary>Homberger r1_10_1: 1,000 stops, above the dense limit, so distances are computed on the fly.</summary>
    public const string R1101 = "r1_10_1";

    /// <summary>r101 with soft time windows: segment concatenation no longer applies, moves take the exact forward pass.</summary>
    public const string R101Soft = "r101-soft";

    public static Instance Load(string name) => name switch
    {
        R101 => Read("solomon/r101.txt"),
        R1101 => Read("homberger/r1_10_1.txt"),
        R101Soft => Read("solomon/r101.txt").With(rules: new RuleSet { TimeWindows = Rule.Soft(1) }),
        _ => throw new ArgumentOutOfRangeException(nameof(name), name, "unknown kernel benchmark instance"),
    };

    private static Instance Read(string relative)
    {
        var root = BenchmarkFolder.Locate() ?? throw new InvalidOperationException("benchmark folder not found");
        var path = Path.Combine(root, relative);
        if (!File.Exists(path))
        {
            throw new FileNotFoundException($"{relative} is absent from {root}; this benchmark cannot run without it", path);
        }

        return SolomonReader.Parse(File.ReadAllText(path), Path.GetFileName(path));
    }
}
