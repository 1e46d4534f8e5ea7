using Anneal.Core.Plans;

namespace Anneal.Core.Solving;

/// <summary>
/// The best plan a running solver has reported so far, held by the run: should the solver not return in time, the
/// run reports this plan rather than none. Solvers offer their best now and then (the local searches at most a few
/// times a second, so the copy costs nothing in their loop); any thread may offer, the best is kept: a plan that
/// keeps every hard rule beats one that breaks some, then the lower objective (the solver's own figure; the run
/// judges the plan it takes with the evaluator).
/// </summary>
public sealed class Incumbent
{
    private readonly object _gate = new();
    private Plan? _plan;
    private bool _feasible;
    private double _objective = double.PositiveInfinity;

    /// <summary>The best plan offered, or null when none was.</summary>
    public Plan? Plan
    {
        get
        {
            lock (_gate)
            {
                return _plan;
            }
        }
    }

    /// <summary>True when a plan of this verdict and objective would be kept: a cheap test before building one.</summary>
    public bool Wants(bool feasible, double objective)
    {
        lock (_gate)
        {
            return Beats(feasible, objective);
        }
    }

    /// <summary>Keeps <paramref name="plan"/> when it beats the plan held.</summary>
    public void Offer(Plan plan, bool feasible, double objective)
    {
        lock (_gate)
        {
            if (Beats(feasible, objective))
            {
                (_plan, _feasible, _objective) = (plan, feasible, objective);
            }
        }
    }

    private bool Beats(bool feasible, double objective) =>
        _plan is null || (feasible && !_feasible) || (feasible == _feasible && objective < _objective - 1e-9);
}
