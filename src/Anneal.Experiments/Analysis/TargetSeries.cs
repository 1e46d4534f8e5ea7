namespace Anneal.Experiments.Analysis;

/// <summary>
/// For one solver and one target (within <paramref name="Percent"/> of the reference): the seconds each run took to
/// reach it, sorted, over <paramref name="Runs"/> runs; runs that never reached it are counted but have no time.
/// </summary>
public sealed record TargetSeries(string Solver, double Budget, double Percent, IReadOnlyList<double> Seconds, int Runs)
{
    /// <summary>Fraction of the runs that reached the target by <paramref name="t"/> seconds.</summary>
    public double FractionBy(double t)
    {
        if (Runs == 0)
        {
            return 0;
        }

        int n = 0;
        foreach (double s in Seconds)
        {
            if (s <= t + 1e-12)
            {
                n++;
            }
        }

        return n / (double)Runs;
    }
}
