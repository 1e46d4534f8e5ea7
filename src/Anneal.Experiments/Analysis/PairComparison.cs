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

        string lower = Test.Direction < 0 ? A : Test.Direction > 0 ? B : "neither";
        string strength = Test.PValue < alpha ? string.Create(CultureInfo.InvariantCulture, $"significant at {alpha:0.##}") : "not significant";
        return $"{lower} tends lower (better); {strength}";
    }
}
