using System.Diagnostics;
using System.Globalization;
using Anneal.Bounds.Pricing;
using Anneal.Bounds.Relaxation;

namespace Anneal.OrTools.Bounds;

/// <summary>
/// Column generation on the route-based relaxation (Desrochers, Desrosiers &amp; Solomon 1992): solve the restricted
/// master, price new routes against its duals, repeat. Heuristic pricing brings columns in fast; exact pricing over
/// the ng-routes, when heuristics find nothing and every few rounds, yields the Lagrangian bound
/// (<see cref="LagrangianBound"/>), offered each time, so stopping at any moment leaves the last proven bound.
/// </summary>
internal sealed class ColumnGeneration(RelaxedInstance relaxed, int minVehicles, int ngSize)
{
    private const int ColumnsPerKind = 150;

    /// <summary>While heuristics still find columns, an exact pricing this often keeps a proven bound coming.</summary>
    private static readonly TimeSpan ExactEvery = TimeSpan.FromSeconds(5);

    private static readonly bool Debug = Environment.GetEnvironmentVariable("ANNEAL_BOUND_DEBUG") == "1";
    private static readonly Stopwatch Clock = Stopwatch.StartNew();

    public int Rounds { get; private set; }

    public long Columns { get; private set; }

    public bool Converged { get; private set; }

    /// <summary>Why the generation ended early, when it did for a reason other than time.</summary>
    public string? Failure { get; private set; }

    public void Run(BoundKeeper keeper, CancellationToken stop)
    {
        var kinds = relaxed.Kinds;
        var networks = new PricingNetwork[kinds.Count];
        for (int k = 0; k < kinds.Count; k++)
        {
            networks[k] = new PricingNetwork(relaxed, kinds[k], ngSize);
            if (stop.IsCancellationRequested)
            {
                return;
            }
        }

        using var master = new RestrictedMaster(relaxed, minVehicles);
        Seed(master, networks);
        var labeling = new NgLabeling();
        var least = new double[kinds.Count];
        var dual = new double[relaxed.StopCount];
        double exactSeconds = 2;
        var sinceExact = Stopwatch.StartNew();
        while (!stop.IsCancellationRequested)
        {
            Rounds++;
            var lpClock = Stopwatch.StartNew();
            if (!master.Solve(TimeSpan.FromSeconds(60), stop))
            {
                Failure = stop.IsCancellationRequested ? null : "the LP solver stopped with status " + master.LastStatus.ToString().ToLowerInvariant();
                return;
            }

            if (Debug)
            {
                Console.Error.WriteLine(string.Create(CultureInfo.InvariantCulture, $"lp {lpClock.Elapsed.TotalMilliseconds:0} ms, {master.Columns} columns"));
            }

            var duals = master.Duals();
            Array.Copy(duals.Stop, dual, dual.Length);
            int added = Price(master, networks, labeling, duals, dual, exact: false, least, stop);
            if (added > 0 && sinceExact.Elapsed < ExactEvery)
            {
                continue;
            }

            sinceExact.Restart();

            // An exact run far from convergence can take long; cap it, and let a cut-short one still bring its columns in.
            using var capped = CancellationTokenSource.CreateLinkedTokenSource(stop);
            capped.CancelAfter(TimeSpan.FromSeconds(Math.Max(1, exactSeconds)));
            added = Price(master, networks, labeling, duals, dual, exact: true, least, capped.Token);
            bool proven = least.All(c => !double.IsNaN(c));
            exactSeconds *= proven ? 1 : 2;
            if (proven)
            {
                keeper.Offer(LagrangianBound.Compute(relaxed, duals, minVehicles, least), string.Create(CultureInfo.InvariantCulture, $"column generation, round {Rounds}"));
            }

            if (added == 0 && proven && !stop.IsCancellationRequested)
            {
                // Nothing new to add: converged, unless the negative routes found were all in the master already (rounding).
                Converged = Converges(least);
                return;
            }
        }
    }

    /// <summary>No route of negative reduced cost is left (beyond rounding): the master's LP value is the relaxation's.</summary>
    private static bool Converges(double[] least)
    {
        foreach (double c in least)
        {
            if (c < -1e-6)
            {
                return false;
            }
        }

        return true;
    }

    /// <summary>Prices every kind; returns the columns added, and in <paramref name="least"/> each kind's proven least reduced cost (NaN when the run was not complete).</summary>
    private int Price(RestrictedMaster master, PricingNetwork[] networks, NgLabeling labeling, Duals duals, double[] dual, bool exact, double[] least, CancellationToken stop)
    {
        int added = 0;
        for (int k = 0; k < networks.Length; k++)
        {
            var kind = networks[k].Kind;
            double constant = kind.FixedCost - duals.Kind[k] - duals.Fleet;
            var result = labeling.Price(networks[k], dual, constant, exact, ColumnsPerKind, stop);
            if (Debug)
            {
                Console.Error.WriteLine(string.Create(CultureInfo.InvariantCulture, $"round {Rounds} kind {k} exact {exact} lp {master.Value:0.###} labels {result.Labels} min {result.MinReducedCost:0.###} complete {result.Complete} routes {result.Routes.Count} at {Clock.Elapsed.TotalSeconds:0.00}"));
            }

            least[k] = exact && result.Complete ? result.MinReducedCost : double.NaN;
            foreach (var route in result.Routes)
            {
                if (master.Add(k, route, RouteCost(networks[k], route)))
                {
                    added++;
                }
            }
        }

        Columns = master.Columns;
        return added;
    }

    private void Seed(RestrictedMaster master, PricingNetwork[] networks)
    {
        // Nearest-neighbour routes of each kind in turn, so the first duals are sensible; single-stop routes after them.
        var covered = new bool[relaxed.StopCount];
        for (int k = 0; k < networks.Length; k++)
        {
            foreach (var route in GreedyRoutes.Build(networks[k], covered, relaxed.Kinds[k].Count))
            {
                master.Add(k, route, RouteCost(networks[k], route));
            }
        }

        for (int i = 0; i < relaxed.StopCount; i++)
        {
            for (int k = 0; k < networks.Length; k++)
            {
                if (networks[k].Serves[i] && RestrictedMaster.HasRow(relaxed, i))
                {
                    master.Add(k, [i], RouteCost(networks[k], [i]));
                }
            }
        }
    }

    private static double RouteCost(PricingNetwork net, int[] route)
    {
        double cost = net.Kind.FixedCost + net.ArcCost(net.StartNode, route[0]);
        for (int p = 1; p < route.Length; p++)
        {
            cost += net.ArcCost(route[p - 1], route[p]);
        }

        return cost + net.ArcCost(route[^1], net.EndNode);
    }
}
