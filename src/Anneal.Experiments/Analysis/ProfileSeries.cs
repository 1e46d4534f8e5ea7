namespace Anneal.Experiments.Analysis;

/// <summary>
/// One solver and budget in a performance profile: the ratio of each of its runs' objective to the best objective any
/// run reached on that instance (infinite for a plan that breaks a hard rule), sorted ascending.
/// </summary>
public sealed record ProfileSeries(string Solver, double Budget, IReadOnlyList<double> Ratios)
{
    /// <summary>ρ(τ): the fraction of runs whose ratio is at most τ (Dolan &amp; Moré 2002, eq. 1, with runs as the problems).</summary>
    public double Rho(double tau)
    {
        if (Ratios.Count == 0)
        {
            return 0;
        }

        int within = 0;
        foreach (double r in Ratios)
        {
            if (r <= tau + 1e-12)
            {
                within++;
            }
        }

        return within / (double)Ratios.Count;
    }
}
