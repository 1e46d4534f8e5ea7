using Anneal.Experiments;

namespace Anneal.Tests.Experiments;

/// <summary>Hand-made results rows for the analysis tests.</summary>
internal static class ExperimentRows
{
    public static BenchRow Row(string instance, string solver, double objective, bool feasible = true, int seed = 1, double budget = 5, double? reference = null) =>
        new(instance, solver, seed, budget, "distance", objective, 3, objective, feasible, 1, budget, reference, null,
            reference is { } r ? (objective / r - 1) * 100 : null, $"traces/{instance}-{solver}-s{seed}.csv");
}
