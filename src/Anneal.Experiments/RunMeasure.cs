namespace Anneal.Experiments;

/// <summary>What one finished run measured, wherever it ran (in this process, or by a worker of the database queue).</summary>
/// <param name="HasPlan">The solver produced a plan (a gap is measured only for one that did).</param>
/// <param name="LowerBound">A lower bound the solver proved, if any.</param>
/// <param name="BoundOnly">The solver proves a bound and offers no plan (`bound`): it has no gap.</param>
public sealed record RunMeasure(
    double ObjectiveValue, int Vehicles, double Distance, bool Feasible, bool HasPlan, double SecondsToBest, double Seconds, double? LowerBound = null, bool BoundOnly = false);
