using Anneal.Bounds.Relaxation;
using Google.OrTools.LinearSolver;

namespace Anneal.OrTools.Bounds;

/// <summary>
/// The restricted master LP of the route-based relaxation, solved with GLOP: minimise the cost of the chosen routes
/// subject to every stop covered at least once (or left out at its price where it may be), at most the kind's vehicle
/// count of routes per kind, and at least the proven vehicle count of routes in all. Covering rather than partitioning
/// is a relaxation too. Its duals drive the pricing; the bound itself is computed from them in
/// <see cref="LagrangianBound"/>, so nothing here needs to be exact or complete: any duals give a valid bound.
/// </summary>
internal sealed class RestrictedMaster : IDisposable
{
    private readonly Solver _lp;
    private readonly RelaxedInstance _relaxed;
    private readonly Constraint?[] _stopRow;
    private readonly Constraint[] _kindRow;
    private readonly Constraint _fleetRow;
    private readonly HashSet<string> _seen = new(StringComparer.Ordinal);
    private bool _presolve;

    public int Columns { get; private set; }

    public RestrictedMaster(RelaxedInstance relaxed, int minVehicles)
    {
        _relaxed = relaxed;
        _lp = Solver.CreateSolver("GLOP") ?? throw new InvalidOperationException("GLOP is not available in this OR-Tools build");
        _lp.Objective().SetMinimization();

        // Without presolve GLOP keeps its basis between solves, so a round that only adds columns starts where the last ended.
        _lp.SetSolverSpecificParametersAsString("use_preprocessing:false");
        int n = relaxed.StopCount;
        _stopRow = new Constraint?[n];
        double big = 1;
        for (int i = 0; i < n; i++)
        {
            foreach (var kind in relaxed.Kinds)
            {
                if (kind.Serves[i])
                {
                    big = Math.Max(big, kind.FixedCost + relaxed.ArcCost(kind, kind.Start, i) + relaxed.ArcCost(kind, i, kind.End));
                }
            }
        }

        for (int i = 0; i < n; i++)
        {
            if (!HasRow(relaxed, i))
            {
                continue;
            }

            var row = _lp.MakeConstraint(1, double.PositiveInfinity, "stop" + i);
            _stopRow[i] = row;

            // Leaving the stop out: at its price where it may be, else an artificial price that keeps the LP feasible.
            var drop = _lp.MakeNumVar(0, 1, "drop" + i);
            row.SetCoefficient(drop, 1);
            _lp.Objective().SetCoefficient(drop, relaxed.Required[i] ? 10 * big : relaxed.DropPrice[i]);
        }

        _kindRow = new Constraint[relaxed.Kinds.Count];
        for (int k = 0; k < _kindRow.Length; k++)
        {
            _kindRow[k] = _lp.MakeConstraint(double.NegativeInfinity, relaxed.Kinds[k].Count, "kind" + k);
        }

        _fleetRow = _lp.MakeConstraint(minVehicles, double.PositiveInfinity, "fleet");
    }

    /// <summary>A stop gets a covering row when some kind serves it and covering it can cost something to avoid.</summary>
    public static bool HasRow(RelaxedInstance relaxed, int stop)
    {
        bool served = false;
        foreach (var kind in relaxed.Kinds)
        {
            served |= kind.Serves[stop];
        }

        return served && (relaxed.Required[stop] || relaxed.DropPrice[stop] > 0);
    }

    /// <summary>Adds a route of the kind (visits counted with repetition); false when it is already in.</summary>
    public bool Add(int kind, int[] route, double cost)
    {
        if (!_seen.Add(kind + ":" + string.Join(',', route)))
        {
            return false;
        }

        var x = _lp.MakeNumVar(0, double.PositiveInfinity, string.Empty);
        _lp.Objective().SetCoefficient(x, cost);
        foreach (int i in route)
        {
            if (_stopRow[i] is { } row)
            {
                row.SetCoefficient(x, row.GetCoefficient(x) + 1);
            }
        }

        _kindRow[kind].SetCoefficient(x, 1);
        _fleetRow.SetCoefficient(x, 1);
        Columns++;
        return true;
    }

    /// <summary>
    /// Solves the LP; false when GLOP did not reach an optimal basis (then the duals are not used). A stop
    /// interrupts GLOP inside its solve, so that the bound keeps its budget however long an LP would take.
    /// </summary>
    public bool Solve(TimeSpan limit, CancellationToken stop)
    {
        using var interrupt = stop.Register(() => _lp.InterruptSolve());
        _lp.SetTimeLimit((long)Math.Max(1, limit.TotalMilliseconds));
        LastStatus = _lp.Solve();
        if (LastStatus != Solver.ResultStatus.OPTIMAL && !_presolve && !stop.IsCancellationRequested)
        {
            // Warm starts without presolve can run into numerical trouble; from then on GLOP solves with its defaults.
            _presolve = true;
            _lp.SetSolverSpecificParametersAsString(string.Empty);
            _lp.Reset();
            LastStatus = _lp.Solve();
        }

        return LastStatus == Solver.ResultStatus.OPTIMAL;
    }

    public double Value => _lp.Objective().Value();

    public Solver.ResultStatus LastStatus { get; private set; }

    /// <summary>Duals with the signs the Lagrangian bound needs: stops ≥ 0, kinds ≤ 0, fleet ≥ 0.</summary>
    public Duals Duals()
    {
        int n = _relaxed.StopCount;
        var stop = new double[n];
        for (int i = 0; i < n; i++)
        {
            stop[i] = _stopRow[i] is { } row ? Math.Max(0, row.DualValue()) : 0;
        }

        var kind = new double[_kindRow.Length];
        for (int k = 0; k < kind.Length; k++)
        {
            kind[k] = Math.Min(0, _kindRow[k].DualValue());
        }

        return new Duals(stop, kind, Math.Max(0, _fleetRow.DualValue()));
    }

    public void Dispose() => _lp.Dispose();
}

/// <summary>Dual prices: per stop row, per kind row, and of the fleet's lower limit.</summary>
internal sealed record Duals(double[] Stop, double[] Kind, double Fleet);
