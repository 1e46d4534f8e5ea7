using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;
using Google.OrTools.Sat;
using Google.OrTools.Util;

namespace Anneal.OrTools;

/// <summary>
/// The CP-SAT formulation. One <c>AddMultipleCircuit</c> per class of identical vehicles, node 0 the depot, node
/// i + 1 stop i, a self-loop when the class does not serve the stop, and a dummy node n + 1 whose loop through the
/// depot stands for "no route" (a multiple circuit needs at least one route). Arc literals carry the constraints:
/// service start t, load delivered so far, and — when duration matters — the route's departure, each propagated
/// along the true arcs (with pickups, the load on board at every point and the pairs' order: <see cref="ExactPickupLoads"/>).
/// A stop is served by exactly one class, or dropped when it may be at its penalty.
/// Integers as in <see cref="IntegerScale"/>, so the optimum is Anneal's up to that scaling.
/// </summary>
public sealed class ExactModel
{
    private readonly Instance _instance;
    private readonly IReadOnlyList<VehicleClass> _classes;
    private readonly ILiteral?[][,] _arc;
    private readonly ILiteral[] _noRoute;
    private readonly ILiteral?[] _dropped;
    private readonly LinearExprBuilder _objective = LinearExpr.NewBuilder();
    private readonly List<ILiteral> _starts = [];
    private readonly bool _scheduleExact;

    // Only for jobs with pickups: the load at every point and the pairs' precedence (null when delivery-only).
    private readonly ExactPickupLoads? _pickups;

    public CpModel Model { get; } = new();
    public IntegerScale Scale { get; }

    /// <summary>"approximated: ..." and similar facts about the mapping.</summary>
    public IReadOnlyList<string> Notes { get; }

    /// <summary>
    /// True when the integer model keeps exactly Anneal's plans (whole times and loads, no schedule approximation), so
    /// that its proven bound, less the cost rounding, bounds Anneal's objective too.
    /// </summary>
    public bool SamePlans { get; }

    /// <param name="hints">Proven facts about every plan (from the `bound` solver's code) that the model may assume.</param>
    public ExactModel(Instance instance, ExactHints? hints = null)
    {
        _instance = instance;
        (Scale, SamePlans) = ExactScale(instance);
        ScalingGuard.Ensure(instance, Scale);
        _classes = VehicleClass.Group(instance);
        int n = instance.StopCount;
        _arc = new ILiteral?[_classes.Count][,];
        _noRoute = new ILiteral[_classes.Count];
        _dropped = new ILiteral?[n];
        var notes = new List<string>(ScheduleApproximations.For(instance));
        _scheduleExact = notes.Count == 0;
        SamePlans &= _scheduleExact;
        var time = new IntVar[n];
        var departure = new IntVar[n];
        var load = new IntVar[n, instance.DimensionCount];
        for (int i = 0; i < n; i++)
        {
            time[i] = Model.NewIntVarFromDomain(WindowDomain(i), "t" + i);
            departure[i] = Model.NewIntVar(0, Scale.Horizon, "dep" + i);
            for (int d = 0; d < instance.DimensionCount; d++)
            {
                long q = Scale.DemandUp(instance.Demand(i, d));
                load[i, d] = Model.NewIntVar(q, Math.Max(q, TotalDemand(d)), $"load{i}.{d}");
            }

            if (!instance.Rules.TimeWindows.Hard && !double.IsPositiveInfinity(instance.Stops[i].Windows[^1].Close))
            {
                var late = Model.NewIntVar(0, Scale.Horizon, "late" + i);
                Model.Add(late >= time[i] - Scale.TimeNearest(instance.Stops[i].Windows[^1].Close));
                _objective.AddTerm(late, Scale.PerTimeStep(instance.Rules.TimeWindows.Price, "lateness price"));
            }
        }

        _pickups = instance.HasPickups ? new ExactPickupLoads(Model, instance, Scale) : null;
        var servedBy = new List<ILiteral>[n];
        for (int i = 0; i < n; i++)
        {
            servedBy[i] = [];
        }

        for (int c = 0; c < _classes.Count; c++)
        {
            BuildClass(c, time, departure, load, servedBy);
        }

        for (int i = 0; i < n; i++)
        {
            var sum = LinearExpr.Sum(servedBy[i]);
            if (instance.MayDrop(i) || servedBy[i].Count == 0)
            {
                var dropped = Model.NewBoolVar("dropped" + i);
                _dropped[i] = dropped;
                Model.Add(sum + dropped == 1);
                _objective.AddTerm(dropped, Scale.Cost(instance.UnservedPrice(i)));
                if (servedBy[i].Count == 0)
                {
                    notes.Add($"stop {instance.Stops[i].Id} needs equipment no vehicle carries; it is left unserved");
                }
            }
            else
            {
                Model.Add(sum == 1);
            }
        }

        Assume(hints, notes);
        Model.Minimize(_objective);
        notes.AddRange(Scale.Notes);
        Notes = notes;
    }

    /// <summary>
    /// At least the proven number of routes, and an objective no lower than the proven bound less what the integer
    /// rounding of costs could take off it (half a step per term, and the rates' relative rounding), so that the
    /// integer model's optimum is never cut off while CP-SAT's own bound starts from the proven one.
    /// </summary>
    private void Assume(ExactHints? hints, List<string> notes)
    {
        if (hints is null)
        {
            return;
        }

        if (hints.MinVehicles > 0)
        {
            Model.Add(LinearExpr.Sum(_starts) >= hints.MinVehicles);
            notes.Add($"assumed at least {hints.MinVehicles} route(s), as the bound proves");
        }

        if (hints.ObjectiveAtLeast is { } lower && lower > 0 && _scheduleExact)
        {
            double terms = 0.5 * ((2 * _instance.StopCount) + (2 * _instance.Vehicles.Count) + 2);
            double scaled = (lower * Scale.CostScale * (1 - (2 * Scale.MaxRateError) - 1e-9)) - terms;
            if (scaled > 0)
            {
                Model.Add(_objective >= (long)Math.Floor(scaled));
            }
        }
    }

    /// <summary>A proven bound of the integer model as a bound of Anneal's objective: the cost rounding taken off, as in <see cref="Assume"/>; null unless <see cref="SamePlans"/>.</summary>
    public double? AnnealBound(double integerBound)
    {
        if (!SamePlans)
        {
            return null;
        }

        double terms = 0.5 * ((2 * _instance.StopCount) + (2 * _instance.Vehicles.Count) + 2);
        return Math.Max(0, (integerBound - terms) / Scale.CostScale * (1 - (2 * Scale.MaxRateError) - 1e-9));
    }

    /// <summary>The routes of a solution, given the value of each literal.</summary>
    public Plan Decode(Func<ILiteral, bool> value)
    {
        int n = _instance.StopCount;
        var routes = new List<PlannedRoute>();
        for (int c = 0; c < _classes.Count; c++)
        {
            var arcs = _arc[c];
            int used = 0;
            for (int first = 1; first <= n; first++)
            {
                if (arcs[0, first] is not { } start || !value(start))
                {
                    continue;
                }

                var stops = new List<int>();
                int at = first;
                while (at != 0 && stops.Count <= n)
                {
                    stops.Add(at - 1);
                    int next = 0;
                    for (int j = 0; j <= n; j++)
                    {
                        if (j != at && arcs[at, j] is { } lit && value(lit))
                        {
                            next = j;
                            break;
                        }
                    }

                    at = next;
                }

                routes.Add(new PlannedRoute(_classes[c].Vehicles[used++], stops.ToArray()));
            }
        }

        return new Plan(routes);
    }

    /// <summary>
    /// Hints CP-SAT with a known plan (AddHint): its arcs on and every other arc off, so the search starts from a
    /// complete solution and, when the plan is feasible for the model, returns at least that plan with a bound.
    /// </summary>
    public void Hint(Plan plan)
    {
        int n = _instance.StopCount;
        var classOf = new int[_instance.Vehicles.Count];
        for (int c = 0; c < _classes.Count; c++)
        {
            foreach (int v in _classes[c].Vehicles)
            {
                classOf[v] = c;
            }
        }

        var on = new HashSet<(int Class, int From, int To)>();
        var servedBy = new int[n];
        Array.Fill(servedBy, -1);
        var used = new bool[_classes.Count];
        foreach (var route in plan.Routes)
        {
            if (route.Stops.Length == 0)
            {
                continue;
            }

            int c = classOf[route.Vehicle];
            used[c] = true;
            int previous = 0;
            foreach (int s in route.Stops)
            {
                on.Add((c, previous, s + 1));
                servedBy[s] = c;
                previous = s + 1;
            }

            on.Add((c, previous, 0));
        }

        for (int c = 0; c < _classes.Count; c++)
        {
            var arcs = _arc[c];
            for (int a = 0; a <= n; a++)
            {
                for (int b = 0; b <= n; b++)
                {
                    if (arcs[a, b] is { } literal)
                    {
                        Model.AddHint(literal, a == b ? servedBy[a - 1] != c : on.Contains((c, a, b)));
                    }
                }
            }

            Model.AddHint(_noRoute[c], !used[c]);
        }

        for (int i = 0; i < n; i++)
        {
            if (_dropped[i] is { } dropped)
            {
                Model.AddHint(dropped, servedBy[i] < 0);
            }
        }
    }

    /// <summary>Replaces the hint by a value for every variable (a solution of this model).</summary>
    public void HintAll(IReadOnlyList<long> values)
    {
        var hint = new PartialVariableAssignment();
        for (int i = 0; i < values.Count; i++)
        {
            hint.Vars.Add(i);
            hint.Values.Add(values[i]);
        }

        Model.Model.SolutionHint = hint;
    }

    private void BuildClass(int c, IntVar[] time, IntVar[] departure, IntVar[,] load, List<ILiteral>[] servedBy)
    {
        var inst = _instance;
        var cls = _classes[c];
        var v = cls.Representative;
        int n = inst.StopCount;
        int home = inst.DepotLocation(v.StartDepot);
        int end = inst.DepotLocation(v.EndDepot);
        var (fixedCost, rate, hourly) = CostTable.RatesOf(inst, v);
        bool durationMatters = hourly > 0 || !double.IsPositiveInfinity(v.MaxDuration);
        var arcs = new ILiteral?[n + 1, n + 1];
        _arc[c] = arcs;
        var circuit = Model.AddMultipleCircuit();

        var noRoute = Model.NewBoolVar($"c{c}.none");
        _noRoute[c] = noRoute;
        circuit.AddArc(0, n + 1, noRoute).AddArc(n + 1, 0, noRoute).AddArc(n + 1, n + 1, noRoute.Not());

        var allowed = new bool[n];
        var capacity = new long[inst.DimensionCount];
        for (int d = 0; d < capacity.Length; d++)
        {
            capacity[d] = Scale.CapacityDown(v.Capacity[d]);
        }

        for (int i = 0; i < n; i++)
        {
            allowed[i] = (inst.Stops[i].Needs & ~v.Equipment) == 0;
            var skip = Model.NewBoolVar($"c{c}.skip{i}");
            circuit.AddArc(i + 1, i + 1, skip);
            arcs[i + 1, i + 1] = skip;
            if (allowed[i])
            {
                servedBy[i].Add(skip.Not());
                _pickups?.Served(i, skip.Not(), capacity);
            }
            else
            {
                Model.Add(skip == 1);
            }
        }

        var starts = new List<ILiteral>();
        for (int a = 0; a <= n; a++)
        {
            for (int b = 0; b <= n; b++)
            {
                if (a == b || (a > 0 && !allowed[a - 1]) || (b > 0 && !allowed[b - 1]) || (a == 0 && b == 0))
                {
                    continue;
                }

                var x = Model.NewBoolVar($"c{c}.x{a}.{b}");
                circuit.AddArc(a, b, x);
                arcs[a, b] = x;
                int from = a == 0 ? home : a - 1;
                int to = b == 0 ? end : b - 1;
                _objective.AddTerm(x, Scale.Cost(inst.Travel.Distance(from, to) * rate));
                long transit = Scale.Transit(from, to);
                if (a == 0)
                {
                    starts.Add(x);
                    _starts.Add(x);
                    _objective.AddTerm(x, Scale.Cost(fixedCost));
                    int j = b - 1;
                    _pickups?.Start(j, x, capacity);
                    if (durationMatters)
                    {
                        Model.Add(departure[j] >= Scale.TimeUp(v.ShiftStart)).OnlyEnforceIf(x);
                        Model.Add(time[j] >= departure[j] + transit).OnlyEnforceIf(x);
                    }
                    else
                    {
                        Model.Add(time[j] >= Scale.TimeUp(v.ShiftStart) + transit).OnlyEnforceIf(x);
                    }
                }
                else if (b == 0)
                {
                    Return(c, a - 1, x, transit, time, departure, load, durationMatters, hourly);
                    _pickups?.Return(a - 1, x);
                }
                else
                {
                    int i = a - 1, j = b - 1;
                    Model.Add(time[j] >= time[i] + transit).OnlyEnforceIf(x);
                    _pickups?.Arc(i, j, x);
                    for (int d = 0; d < inst.DimensionCount; d++)
                    {
                        Model.Add(load[j, d] >= load[i, d] + Scale.DemandUp(inst.Demand(j, d))).OnlyEnforceIf(x);
                    }

                    if (durationMatters)
                    {
                        Model.Add(departure[j] == departure[i]).OnlyEnforceIf(x);
                    }
                }
            }
        }

        // Real routes: none when the dummy loop is used, at most one per vehicle of the class otherwise.
        var routes = LinearExpr.Sum(starts);
        Model.Add(routes <= cls.Vehicles.Count).OnlyEnforceIf(noRoute.Not());
        Model.Add(routes >= 1).OnlyEnforceIf(noRoute.Not());
        Model.Add(routes == 0).OnlyEnforceIf(noRoute);
    }

    /// <summary>Constraints and prices on the last arc of a route: shift end, capacity, duration.</summary>
    private void Return(int c, int i, ILiteral x, long transit, IntVar[] time, IntVar[] departure, IntVar[,] load, bool durationMatters, double hourly)
    {
        var inst = _instance;
        var rules = inst.Rules;
        var v = _classes[c].Representative;
        var back = time[i] + transit;
        if (!double.IsPositiveInfinity(v.ShiftEnd))
        {
            Limit(back, x, rules.ShiftEnd, Scale.TimeDown(v.ShiftEnd), Scale.TimeNearest(v.ShiftEnd), Scale.Horizon,
                Scale.PerTimeStep(rules.ShiftEnd.Price, "overtime price"), $"c{c}.overtime{i}");
        }

        for (int d = 0; d < inst.DimensionCount; d++)
        {
            double cap = v.Capacity[d];
            if (double.IsPositiveInfinity(cap) || _pickups is not null)
            {
                continue;
            }

            Limit(load[i, d], x, rules.Capacity, Scale.CapacityDown(cap), Scale.LoadNearest(cap), TotalDemand(d),
                Scale.PerLoadStep(rules.Capacity.Price, "overload price"), $"c{c}.overload{i}.{d}");
        }

        if (!durationMatters)
        {
            return;
        }

        var duration = back - departure[i];
        if (hourly > 0)
        {
            var span = Model.NewIntVar(0, Scale.Horizon, $"c{c}.duration{i}");
            Model.Add(span >= duration).OnlyEnforceIf(x);
            _objective.AddTerm(span, Scale.PerTimeStep(hourly, "cost per hour"));
        }

        if (!double.IsPositiveInfinity(v.MaxDuration))
        {
            Limit(duration, x, rules.MaxDuration, Scale.DurationDown(v.MaxDuration), Scale.DurationNearest(v.MaxDuration), Scale.Horizon,
                Scale.PerTimeStep(rules.MaxDuration.Price, "price per time over the maximum duration"), $"c{c}.excess{i}");
        }
    }

    /// <summary>When <paramref name="x"/> holds: value ≤ the hard bound, or the excess over the soft bound is priced.</summary>
    private void Limit(LinearExpr value, ILiteral x, Rule rule, long hardBound, long softBound, long maxExcess, long price, string name)
    {
        if (rule.Hard)
        {
            Model.Add(value <= hardBound).OnlyEnforceIf(x);
            return;
        }

        var excess = Model.NewIntVar(0, maxExcess, name);
        Model.Add(excess >= value - softBound).OnlyEnforceIf(x);
        _objective.AddTerm(excess, price);
    }

    /// <summary>
    /// CP-SAT proves far faster with small numbers: one step per unit when every time (or load) of the instance is
    /// whole, else 100 steps; cost steps 1000 per time step, so a price per time unit keeps three digits.
    /// Integer data is then exact.
    /// </summary>
    private static (IntegerScale Scale, bool Exact) ExactScale(Instance instance)
    {
        bool wholeTimes = true, wholeLoads = true;
        foreach (var s in instance.Stops)
        {
            wholeTimes &= Whole(s.ServiceTime);
            foreach (var w in s.Windows)
            {
                wholeTimes &= Whole(w.Open) && Whole(w.Close);
            }

            foreach (double q in s.Demand)
            {
                wholeLoads &= Whole(q);
            }
        }

        foreach (var v in instance.Vehicles)
        {
            wholeTimes &= Whole(v.ShiftStart) && Whole(v.ShiftEnd) && Whole(v.MaxDuration);
            foreach (double q in v.Capacity)
            {
                wholeLoads &= Whole(q);
            }
        }

        for (int a = 0; a < instance.Travel.Count && wholeTimes; a++)
        {
            for (int b = 0; b < instance.Travel.Count; b++)
            {
                wholeTimes &= Whole(instance.Travel.Duration(a, b));
            }
        }

        double timeSteps = wholeTimes ? 1 : 100;
        return (new IntegerScale(instance, timeSteps, wholeLoads ? 1 : 100, maxCostScale: 1000 * timeSteps), wholeTimes && wholeLoads);
    }

    private static bool Whole(double x) => double.IsInfinity(x) || Math.Abs(x - Math.Round(x)) < 1e-9;

    /// <summary>Hard: the windows themselves. Soft: the same, the last one open to the horizon (lateness is priced).</summary>
    private Domain WindowDomain(int stop)
    {
        var windows = _instance.Stops[stop].Windows;
        bool hard = _instance.Rules.TimeWindows.Hard;
        var intervals = new List<long[]>();
        for (int w = 0; w < windows.Length; w++)
        {
            long open = Scale.TimeUp(windows[w].Open);
            long close = !hard && w == windows.Length - 1 ? Scale.Horizon : Scale.TimeDown(windows[w].Close);
            if (open <= close)
            {
                intervals.Add([open, close]);
            }
        }

        return intervals.Count > 0 ? Domain.FromIntervals(intervals.ToArray()) : Domain.FromValues([Scale.Horizon]);
    }

    private long TotalDemand(int d)
    {
        long total = 0;
        for (int i = 0; i < _instance.StopCount; i++)
        {
            total += Scale.DemandUp(_instance.Demand(i, d));
        }

        return total;
    }
}
