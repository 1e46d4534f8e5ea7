using Anneal.Core.Model;
using Anneal.Search.Construction;
using Anneal.Search.Moves;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Randomness;
using Anneal.Search.Representation;

namespace Anneal.Benchmarks;

/// <summary>
/// What a move benchmark runs over, put together as the search does (see ThroughputProbe): candidate lists of 30,
/// a state built by cheapest insertion, and a seeded sampler of granular moves.
/// </summary>
public sealed class KernelFixture
{
    public const int CandidateCount = 30;

    public Instance Instance { get; }
    public SearchState State { get; }
    public MoveSampler Sampler { get; }

    private KernelFixture(Instance instance, SearchState state, MoveSampler sampler)
    {
        Instance = instance;
        State = state;
        Sampler = sampler;
    }

    public static KernelFixture Build(string name, int seed = 1)
    {
        var instance = KernelInstances.Load(name);
        var candidates = new CandidateLists(instance, CandidateCount);
        var state = InsertionSolver.Build(instance, candidates);
        CheckPath(name, instance, state);
        return new KernelFixture(instance, state, new MoveSampler(state, candidates, new SearchRandom(seed)));
    }

    /// <summary>A fixed set of moves the sampler offers (draws it declines are skipped), so a benchmark can time evaluation alone.</summary>
    public MoveDraft[] Draw(int count)
    {
        var moves = new MoveDraft[count];
        int filled = 0;
        for (long attempts = 0; filled < count; attempts++)
        {
            if (attempts > 1000L * count)
            {
                throw new InvalidOperationException($"the sampler offered only {filled} moves on {Instance.Name}");
            }

            if (Sampler.Next(ref moves[filled]))
            {
                filled++;
            }
        }

        return moves;
    }

    // The benchmark names promise a path; fail loudly rather than time a different one.
    private static void CheckPath(string name, Instance instance, SearchState state)
    {
        var (fast, dense) = name switch
        {
            KernelInstances.R101 => (true, true),
            KernelInstances.R1101 => (true, false),
            _ => (false, true),
        };
        if (state.FastPath != fast || instance.Travel.IsDense != dense)
        {
            throw new InvalidOperationException(
                $"{name}: expected fast path {fast} and dense matrix {dense}, found {state.FastPath} and {instance.Travel.IsDense}");
        }
    }
}
