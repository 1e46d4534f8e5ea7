using Anneal.Core.Evaluation;

namespace Anneal.Bounds.Safety;

/// <summary>
/// The evaluator calls a plan feasible when each broken amount is at most <see cref="CostModel.FeasibilityTolerance"/>;
/// a relaxation must admit every such plan, so each hard limit is widened by that tolerance plus a relative margin
/// for the rounding of the sums that reach it.
/// </summary>
public static class Tolerance
{
    private const double Relative = 1e-9;

    public static double Widen(double limit) =>
        double.IsInfinity(limit) ? limit : limit + CostModel.FeasibilityTolerance + (Relative * Math.Abs(limit));
}
