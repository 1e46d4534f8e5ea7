using Anneal.Experiments.Statistics;

namespace Anneal.Experiments.Analysis;

/// <summary>One solver at one budget over all instances and seeds.</summary>
/// <param name="Gap">Spread of the gaps of its feasible runs.</param>
/// <param name="BestCount">Instances where its mean gap over seeds was the lowest of all solvers at this budget (ties count for each).</param>
/// <param name="Instances">Instances it ran on.</param>
public sealed record ConfigStats(string Solver, double Budget, int Runs, int Feasible, Spread Gap, int BestCount, int Instances);
