using Anneal.Core.Evaluation;
using Anneal.Search.Representation;

namespace Anneal.Search.Strategy;

/// <summary>
/// Adaptive prices for hard-rule violations (Cordeau, Laporte &amp; Mercier 2001): a rule the current plan breaks
/// gets dearer by (1 + delta), one it respects gets cheaper, within bounds, so the search can cross infeasible
/// ground without settling there.
/// </summary>
public sealed class PenaltyAdapter
{
    private readonly double _factor;
    private readonly double _min;
    private readonly double _max;
    private PenaltyWeights _weights;

    public PenaltyAdapter(PenaltyWeights initial, double delta, double min, double max)
    {
        _weights = initial;
        _factor = 1 + delta;
        _min = min;
        _max = max;
    }

    public PenaltyWeights Weights => _weights;

    public void Update(SearchState state)
    {
        var v = state.CurrentViolations();
        _weights.TimeWindow = Step(_weights.TimeWindow, v.TimeWindow > 0);
        _weights.Capacity = Step(_weights.Capacity, v.Capacity > 0);
        _weights.Overtime = Step(_weights.Overtime, v.Overtime > 0);
        _weights.Duration = Step(_weights.Duration, v.Duration > 0);
        _weights.Equipment = Step(_weights.Equipment, v.Equipment > 0);
        state.SetWeights(_weights);
    }

    private double Step(double w, bool violated) => Math.Clamp(violated ? w * _factor : w / _factor, _min, _max);
}
