namespace Anneal.Experiments.Analysis;

/// <summary>A run with the gap the statistics use: to the reference file's value when it has one, else to the best found in the experiment.</summary>
/// <param name="Gap">Percent above the reference; null for a run whose plan breaks a hard rule (it counts as a failure, not a gap).</param>
/// <param name="FromReference">True when the gap is to a reference value from the file, false when to the experiment's best.</param>
public sealed record RunGap(BenchRow Row, double? Gap, bool FromReference);
