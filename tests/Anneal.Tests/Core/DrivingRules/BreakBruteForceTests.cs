using Anneal.Core.DrivingRules;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Core.Plans;

namespace Anneal.Tests.Core.DrivingRules;

/// <summary>
/// The break scheduler against a brute force of its own on small random routes (integer legs, windows and service,
/// short random limits). The brute force knows nothing of the scheduler's choices: it lets the driver stop for any
/// rest at any whole minute of a leg, start service at any whole minute the window allows, and rest after service,
/// and counts every rest at a stop or on the road as a break of its length (a full one, a first part, or the part that
/// completes it). Checked: whenever some schedule keeps every window and the driving limit, the scheduler's keeps the
/// windows too, it returns no later when it leaves at the shift start, and no stretch of its driving passes the limit.
/// </summary>
public class BreakBruteForceTests
{
    [Fact]
    public void The_scheduler_finds_a_legal_placement_whenever_one_exists_and_never_drives_past_the_limit()
    {
        var rng = new Random(2209);
        int found = 0, withBreaks = 0;
        for (int trial = 0; trial < 80; trial++)
        {
            int n = rng.Next(1, 4);
            var stops = new Stop[n];
            for (int i = 0; i < n; i++)
            {
                int open = rng.Next(0, 90);
                stops[i] = TinyInstances.Stop("s" + i, rng.Next(-25, 26), open: open, close: open + rng.Next(0, 40)) with { ServiceTime = rng.Next(0, 8) };
            }

            // As in the presets, a split break's parts add up to a full one (15 + 30 = 45 under eu-561).
            bool split = rng.Next(2) == 0;
            int full = rng.Next(6, 14);
            var rules = new DrivingRuleSet
            {
                Name = "tiny",
                DrivingBeforeBreak = rng.Next(20, 50),
                BreakMinutes = full,
                SplitFirst = split ? 2 : 0,
                SplitSecond = split ? full - 2 : 0,
                DailyDriving = 10_000,
                DutySpan = 10_000,
                WaitingCounts = true,
            };
            var vehicle = TinyInstances.Vehicle("v") with { ShiftStart = 0, ShiftEnd = 10_000, DrivingRules = rules };
            var instance = TinyInstances.Line(stops, [vehicle], RuleSet.AllHard);
            var route = Enumerable.Range(0, n).ToArray();

            int best = new Brute(instance, route, rules).Best();
            var r = PlanEvaluator.Evaluate(instance, new Plan([new PlannedRoute(0, route)])).Routes[0];
            AssertStretches(instance, route, r, rules, trial);
            withBreaks += r.Breaks.Count > 0 ? 1 : 0;
            if (best == int.MaxValue)
            {
                continue;
            }

            found++;
            Assert.True(r.Metrics.TimeWindowViolation <= 1e-6, $"trial {trial}: a legal schedule returns at {best}, the scheduler's is {r.Metrics.TimeWindowViolation} late");
            if (r.Metrics.Departure <= 1e-9)
            {
                Assert.True(r.Metrics.Return <= best + 1e-6, $"trial {trial}: brute force returns at {best}, the scheduler at {r.Metrics.Return}; " + Describe(stops, rules, r));
            }
        }

        Assert.True(found > 30 && withBreaks > 30, $"{found} routes with a legal schedule, {withBreaks} with breaks");
    }

    private static string Describe(Stop[] stops, DrivingRuleSet rules, RouteEvaluation r) =>
        $"rules {rules.DrivingBeforeBreak}/{rules.BreakMinutes}/{rules.SplitFirst}+{rules.SplitSecond}; stops "
        + string.Join(" ", stops.Select(s => $"x{s.X} [{s.Windows[0].Open},{s.Windows[0].Close}] svc{s.ServiceTime}"))
        + "; visits " + string.Join(" ", r.Visits.Select(v => $"a{v.Arrival} s{v.Start} d{v.Departure}"))
        + "; breaks " + string.Join(" ", r.Breaks.Select(b => $"{b.Place}@{b.Position} {b.Start}-{b.End} part{b.FirstPart}"));

    /// <summary>Re-reads the scheduler's breaks and drives: no stretch between full breaks (or a first part and its completion) passes the limit.</summary>
    private static void AssertStretches(Instance instance, int[] route, RouteEvaluation r, DrivingRuleSet rules, int trial)
    {
        double total = 0;
        foreach (var v in r.Visits)
        {
            total += v.Drive;
        }

        double stretch = 0;
        bool part = false;
        int b = 0;
        for (int k = 0; k <= route.Length; k++)
        {
            for (; b < r.Breaks.Count && r.Breaks[b].Position == k && r.Breaks[b].Place != BreakPlace.AfterService; b++)
            {
                stretch = Rest(stretch + r.Breaks[b].Drive, r.Breaks[b].Minutes, rules, ref part, trial);
            }

            if (k < route.Length)
            {
                stretch += r.Visits[k].Drive;
                Assert.True(stretch <= rules.DrivingBeforeBreak + 1e-6, $"trial {trial}: {stretch} driven before stop {k}");
                for (; b < r.Breaks.Count && r.Breaks[b].Position == k; b++)
                {
                    stretch = Rest(stretch, r.Breaks[b].Minutes, rules, ref part, trial);
                }
            }
        }

        double home = instance.Travel.Duration(route[^1], instance.DepotLocation(0));
        double homeDrive = home - r.Breaks.Where(x => x.Position == route.Length).Sum(x => x.Drive);
        Assert.True(stretch + homeDrive <= rules.DrivingBeforeBreak + 1e-6, $"trial {trial}: {stretch + homeDrive} driven on the way home");
    }

    private static double Rest(double stretch, double minutes, DrivingRuleSet rules, ref bool part, int trial)
    {
        Assert.True(stretch <= rules.DrivingBeforeBreak + 1e-6, $"trial {trial}: {stretch} driven before a break");
        if (minutes >= rules.BreakMinutes - 1e-9 || (part && minutes >= rules.SplitSecond - 1e-9))
        {
            part = false;
            return 0;
        }

        part |= rules.MaySplit && minutes >= rules.SplitFirst - 1e-9;
        return stretch;
    }

    /// <summary>Earliest legal return by search over whole minutes (memoised), or int.MaxValue when none keeps the windows.</summary>
    private sealed class Brute(Instance instance, int[] route, DrivingRuleSet rules)
    {
        private readonly Dictionary<(int, int, int, int, bool), int> _memo = [];
        private readonly int _limit = (int)rules.DrivingBeforeBreak;

        public int Best() => Leg(0, 0, 0, 0, false);

        private int LegLength(int k)
        {
            int from = k == 0 ? instance.DepotLocation(0) : route[k - 1];
            int to = k == route.Length ? instance.DepotLocation(0) : route[k];
            return (int)Math.Round(instance.Travel.Duration(from, to));
        }

        /// <summary>On leg k, <paramref name="done"/> minutes of it driven, at clock t with d driven since the last break.</summary>
        private int Leg(int k, int done, int t, int d, bool part)
        {
            if (t > 250)
            {
                return int.MaxValue;
            }

            var key = (k, done, t, d, part);
            if (_memo.TryGetValue(key, out int known))
            {
                return known;
            }

            int best = int.MaxValue;
            if (done == LegLength(k))
            {
                best = k == route.Length ? t : Stop(k, t, d, part);
            }
            else
            {
                if (d < _limit)
                {
                    best = Leg(k, done + 1, t + 1, d + 1, part);
                }

                foreach (int r in Rests())
                {
                    var (d2, p2) = After(d, part, r);
                    best = Math.Min(best, Leg(k, done, t + r, d2, p2));
                }
            }

            _memo[key] = best;
            return best;
        }

        private int Stop(int k, int arrival, int d, bool part)
        {
            int s = route[k];
            var w = instance.Stops[s].Windows[0];
            int best = int.MaxValue;
            for (int start = Math.Max(arrival, (int)w.Open); start <= w.Close; start++)
            {
                var (d1, p1) = After(d, part, start - arrival);
                int leave = start + (int)instance.Stops[s].ServiceTime;
                best = Math.Min(best, Leg(k + 1, 0, leave, d1, p1));
                foreach (int r in Rests())
                {
                    var (d2, p2) = After(d1, p1, r);
                    best = Math.Min(best, Leg(k + 1, 0, leave + r, d2, p2));
                }
            }

            return best;
        }

        private IEnumerable<int> Rests() => rules.MaySplit
            ? [(int)rules.SplitFirst, (int)rules.SplitSecond, (int)rules.BreakMinutes]
            : [(int)rules.BreakMinutes];

        private (int Drive, bool Part) After(int d, bool part, int rest)
        {
            if (rest >= rules.BreakMinutes || (part && rest >= rules.SplitSecond))
            {
                return (0, false);
            }

            return (d, part || (rules.MaySplit && rest >= rules.SplitFirst));
        }
    }
}
