namespace Anneal.Reports.Quality;

/// <summary>The spread of gaps to the reference (percent) over all runs of one solver at one moment.</summary>
public readonly record struct GapPoint(double Seconds, double Median, double Lower, double Upper, int Runs);
