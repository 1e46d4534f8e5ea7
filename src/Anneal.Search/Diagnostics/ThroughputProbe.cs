using System.Diagnostics;
using Anneal.Core.Model;
using Anneal.Search.Construction;
using Anneal.Search.Moves;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Randomness;

namespace Anneal.Search.Diagnostics;

/// <summary>How many random granular moves per second the evaluation kernel judges on one core (no moves applied).</summary>
public static class ThroughputProbe
{
    public static double EvaluationsPerSecond(Instance instance, double seconds, int seed = 1)
    {
        var candidates = new CandidateLists(instance, 30);
        var state = InsertionSolver.Build(instance, candidates);
        var sampler = new MoveSampler(state, candidates, new SearchRandom(seed));
        var move = default(MoveDraft);
        double sink = 0;
        long evaluations = 0;
        var clock = Stopwatch.StartNew();
        while (clock.Elapsed.TotalSeconds < seconds)
        {
            for (int k = 0; k < 4096; k++)
            {
                if (sampler.Next(ref move))
                {
                    sink += state.Evaluate(ref move).Penalized;
                    evaluations++;
                }
            }
        }

        GC.KeepAlive(sink);
        return evaluations / clock.Elapsed.TotalSeconds;
    }
}
