using System.Globalization;

namespace Anneal.Experiments;

/// <summary>
/// What makes a run the same run again: instance, solver, seed, budget and objective. A resumed experiment skips every
/// planned run whose key is already in results.csv. The budget is compared as results.csv writes it.
/// </summary>
public readonly record struct RunKey(string Instance, string Solver, int Seed, string Budget, string Objective)
{
    public static RunKey Of(BenchRow row) => new(row.Instance, row.Solver.ToLowerInvariant(), row.Seed, BudgetText(row.BudgetSeconds), row.Objective);

    public static RunKey Of(PlannedRun run) => new(run.Instance.Name, run.Solver.ToLowerInvariant(), run.Seed, BudgetText(run.BudgetSeconds), run.Objective);

    /// <summary>"instance/solver/s1/10s/distance": the key in one piece, for messages and the queue's job labels.</summary>
    public string Label() => $"{Instance}/{Solver}/s{Seed.ToString(CultureInfo.InvariantCulture)}/{Budget}s/{Objective}";

    public static string BudgetText(double seconds) => seconds.ToString("0.######", CultureInfo.InvariantCulture);
}
