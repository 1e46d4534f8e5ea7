using Anneal.Search.Construction;
using Anneal.Search.Moves;
using Anneal.Search.Neighbourhoods;
using Anneal.Search.Representation;

namespace Anneal.Search.Tabu;

/// <summary>
/// Every move of the neighbourhood with its effect split by rule (<see cref="MoveParts"/>), cached per stop pair
/// and recomputed only when one of the two routes changed, so that changing prices needs no re-evaluation.
/// </summary>
internal sealed class TabuMoves
{
    private readonly SearchState _state;
    private readonly CandidateLists _candidates;
    private readonly int _k;

    // Per (stop, neighbour index): the routes and their versions the parts were computed for.
    private readonly int[] _routeU;
    private readonly int[] _routeV;
    private readonly int[] _versionU;
    private readonly int[] _versionV;
    private readonly MoveParts[] _parts;
    private readonly bool[] _valid;

    // Per stop: to an empty route or out of every route, or into an empty route when unserved.
    private readonly MoveParts[] _soloParts;
    private readonly bool[] _soloValid;
    private readonly int[] _soloRoute;
    private readonly int[] _soloVersion;
    private readonly int[] _soloTarget;

    public TabuMoves(SearchState state, CandidateLists candidates)
    {
        _state = state;
        _candidates = candidates;
        _k = candidates.K;
        int n = state.StopCount;
        int pairs = n * _k;
        _routeU = new int[pairs];
        _routeV = new int[pairs];
        _versionU = new int[pairs];
        _versionV = new int[pairs];
        Array.Fill(_versionU, -1);
        _parts = new MoveParts[pairs * PairMoves.Slots];
        _valid = new bool[pairs * PairMoves.Slots];
        int solos = PairMoves.Solo.Length;
        _soloParts = new MoveParts[n * solos];
        _soloValid = new bool[n * solos];
        _soloRoute = new int[n];
        _soloVersion = new int[n];
        Array.Fill(_soloVersion, -1);
        _soloTarget = new int[n];
    }

    /// <summary>Whether slot <paramref name="slot"/> of the pair (u, its j-th neighbour: pair u·k + j) applies.</summary>
    public bool Valid(int pair, int slot) => _valid[(pair * PairMoves.Slots) + slot];

    /// <summary>The cached parts of a pair's slot (read only when <see cref="Valid"/>).</summary>
    public ref readonly MoveParts Parts(int pair, int slot) => ref _parts[(pair * PairMoves.Slots) + slot];

    public bool SoloValid(int u, int slot) => _soloValid[(u * PairMoves.Solo.Length) + slot];

    public ref readonly MoveParts SoloParts(int u, int slot) => ref _soloParts[(u * PairMoves.Solo.Length) + slot];

    /// <summary>The empty route stop u's solo move goes to (or -1 when every vehicle has a route).</summary>
    public int SoloTarget(int u) => _soloTarget[u];

    /// <summary>Recomputes the pair's moves when either route changed since they were cached.</summary>
    public void Refresh(int pair, int u, int v)
    {
        int ru = _state.RouteOf(u), rv = _state.RouteOf(v);
        int vu = ru >= 0 ? _state.Version(ru) : 0;
        int vv = rv >= 0 ? _state.Version(rv) : 0;
        if (_routeU[pair] == ru && _routeV[pair] == rv && _versionU[pair] == vu && _versionV[pair] == vv)
        {
            return;
        }

        _routeU[pair] = ru;
        _routeV[pair] = rv;
        _versionU[pair] = vu;
        _versionV[pair] = vv;
        var move = default(MoveDraft);
        for (int slot = 0; slot < PairMoves.Slots; slot++)
        {
            int index = (pair * PairMoves.Slots) + slot;
            _valid[index] = PairMoves.Build(_state, ref move, u, v, slot);
            if (_valid[index])
            {
                _parts[index] = _state.EvaluateParts(ref move);
            }
        }
    }

    /// <summary>Recomputes stop u's solo moves when its route changed or its empty route was taken.</summary>
    public void RefreshSolo(int u)
    {
        int ru = _state.RouteOf(u);
        int version = ru >= 0 ? _state.Version(ru) : -2;
        int target = _soloTarget[u];
        bool targetStillEmpty = target >= 0 && target < _state.RouteCount && _state.Length(target) == 0;
        if (_soloRoute[u] == ru && _soloVersion[u] == version && targetStillEmpty)
        {
            return;
        }

        _soloRoute[u] = ru;
        _soloVersion[u] = version;
        _soloTarget[u] = CheapestInsertion.FirstEmptyRoute(_state);
        var move = default(MoveDraft);
        for (int slot = 0; slot < PairMoves.Solo.Length; slot++)
        {
            int index = (u * PairMoves.Solo.Length) + slot;
            _soloValid[index] = BuildSolo(ref move, u, slot);
            if (_soloValid[index])
            {
                _soloParts[index] = _state.EvaluateParts(ref move);
            }
        }
    }

    /// <summary>Drafts stop u's solo move: onto its empty route (into it when unserved), or out of every route.</summary>
    public bool BuildSolo(ref MoveDraft move, int u, int slot)
    {
        int ru = _state.RouteOf(u);
        int empty = _soloTarget[u];
        bool toEmpty = PairMoves.Solo[slot] != MoveKind.Drop;
        if (ru < 0)
        {
            return toEmpty && empty >= 0 && MoveBuilder.Insert(_state, ref move, u, -1, false, empty);
        }

        return toEmpty
            ? empty >= 0 && MoveBuilder.ToEmptyRoute(_state, ref move, u, empty)
            : _state.Instance.MayDrop(u) && MoveBuilder.Drop(_state, ref move, u);
    }
}
