using Anneal.Core.Model;
using Anneal.Search.Construction;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Representation;
using Anneal.Core.Solving;

namespace Anneal.Search.Strategy;

/// <summary>What every local-search strategy starts from: its budget and trace, the candidate lists and a constructed plan (or the options' start plan).</summary>
public sealed record SearchStart(Budget Budget, TraceRecorder Trace, CandidateLists Candidates, SearchState State)
{
    public static SearchStart Begin(Instance instance, SolveOptions options, int neighbours, IProgress<TracePoint>? progress, CancellationToken cancel)
    {
        var budget = new Budget(options, cancel);
        var trace = new TraceRecorder(progress, options.TimeLimit.TotalSeconds);
        var candidates = new CandidateLists(instance, neighbours);

        // The construction stops at the deadline too (with the stops placed so far), not only on a stop request.
        using var deadline = CancellationTokenSource.CreateLinkedTokenSource(cancel);
        deadline.CancelAfter(options.TimeLimit - TimeSpan.FromSeconds(Math.Min(budget.Elapsed, options.TimeLimit.TotalSeconds)));
        return new SearchStart(budget, trace, candidates, options.StartPlan is { } start ? FromPlan(instance, start) : InsertionSolver.Build(instance, candidates, deadline.Token));
    }

    /// <summary>A warm start: the given plan as it is (under the construction's weights, as a constructed plan would be).</summary>
    private static SearchState FromPlan(Instance instance, Core.Plans.Plan plan)
    {
        var state = new SearchState(instance, InitialWeights.ForConstruction(instance));
        state.Load(plan);
        return state;
    }

    /// <summary>Adaptive hard-rule prices for this instance, starting near the typical arc cost.</summary>
    public PenaltyAdapter Prices(double delta)
    {
        var instance = State.Instance;
        var adapter = new PenaltyAdapter(InitialWeights.For(instance, 10), delta, InitialWeights.TypicalArcCost(instance) * 0.01, InitialWeights.Ceiling(instance));
        State.SetWeights(adapter.Weights);
        return adapter;
    }
}
