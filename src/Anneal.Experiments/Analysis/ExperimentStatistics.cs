namespace Anneal.Experiments.Analysis;

/// <summary>Everything the summary says in numbers about an experiment.</summary>
/// <param name="WithoutReference">Instances (with objective) whose gaps are to the best found in the experiment, as no reference value was given.</param>
public sealed record ExperimentStatistics(
    IReadOnlyList<RunGap> Gaps,
    IReadOnlyList<ConfigStats> Configs,
    IReadOnlyList<PairComparison> Pairs,
    IReadOnlyList<string> WithoutReference,
    int Instances);
