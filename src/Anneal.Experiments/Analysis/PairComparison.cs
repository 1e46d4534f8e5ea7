using System.Globalization;
using Anneal.Experiments.Statistics;

namespace Anneal.Experiments.Analysis;

/// <summary>Two solvers at one budget compared over the instances both solved, pairing their mean gaps over seeds.</summary>
public sealed record PairComparison(double Budget, string A, string B, WilcoxonResult Test)
{
    /// <summary>"sa lower (better) on 7 of 9 instances" and the like, for the summary.</summary>
    public string Verdict(double alpha = 0.05)
    {
        if (Test.Pairs == 0)
        {
            return "no difference on any instance";
        }

        if (Test.Direction == 0)
        {
            return "no tendency either way";
        }

        // The direction is the test's own (which rank sum is smaller), so it can disagree with the median difference on small samples.
        string lower = Test.Direction < 0 ? A : B;
        return Test.PValue < alpha
            ? string.Create(CultureInfo.InvariantCulture, $"{lower} lower (better), significant at {alpha:0.##}")
            : $"{lower} lower by signed ranks, not significant";
    }
}
