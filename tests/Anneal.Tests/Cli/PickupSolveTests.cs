using System.Globalization;
using Anneal.Cli;

namespace Anneal.Tests.Cli;

/// <summary>
/// `anneal solve` on the Li &amp; Lim file lc101 (Li &amp; Lim 2001), by each solver that takes pairs and by the
/// default set: the plan's routes.csv is checked here on its own,
/// without the evaluator, from the instance file's task lines: every task once, each pair on one vehicle with the
/// pickup first, arrivals within the windows (service starts at max(arrival, earliest), Euclidean travel at speed 1)
/// and the load on board (recomputed from the file's demands) within the capacity after every stop.
/// </summary>
public sealed class PickupSolveTests : CommandTest
{
    // An iteration budget, not the clock, ends each search (for OR-Tools a solution limit), so every run is the same
    // on any machine; "" runs the default solvers, as `anneal solve lc101.txt` does.
    [SkippableTheory]
    [InlineData("ortools", 2)]
    [InlineData("sa", 20000)]
    [InlineData("tabu", 100)]
    [InlineData("insertion", 1)]
    [InlineData("", 2)]
    public void Lc101_gives_a_plan_whose_routes_pass_an_independent_check(string solvers, int iterations)
    {
        string file = BenchmarkData.File("lilim/lc101.txt");
        string outDir = Path.Combine(Dir, "lc101");
        string[] choice = solvers.Length > 0 ? ["--solvers", solvers] : [];
        int code = CliApp.Run(["solve", file, .. choice, "--iterations", iterations.ToString(CultureInfo.InvariantCulture), "--time", "120", "--out", outDir, "--quiet"], Out, Err);

        Assert.True(code == 0, All);
        var tasks = Tasks(file, out double capacity);
        var rows = File.ReadAllLines(Path.Combine(outDir, "routes.csv"));
        var header = rows[0].Split(',');
        int Col(string name) => Array.IndexOf(header, name);
        var served = new Dictionary<int, (string Vehicle, int Sequence)>();
        var previous = new Dictionary<string, (int Task, double Time, double Load)>();
        foreach (var line in rows.Skip(1))
        {
            var f = line.Split(',');
            string vehicle = f[Col("vehicle")];
            string kind = f[Col("kind")];
            int task = int.Parse(f[Col("stop")], CultureInfo.InvariantCulture);
            double load = double.Parse(f[Col("load_demand")], CultureInfo.InvariantCulture);
            if (kind == "start")
            {
                Assert.Equal(0, load);
                previous[vehicle] = (0, tasks[0].Earliest, 0);
                continue;
            }

            var (from, time, onBoard) = previous[vehicle];
            var t = tasks[task];
            double arrival = time + Math.Sqrt(Math.Pow(t.X - tasks[from].X, 2) + Math.Pow(t.Y - tasks[from].Y, 2));
            Assert.True(arrival <= t.Latest + 1e-6, $"task {task} reached at {arrival}, after its latest {t.Latest}");
            if (kind == "end")
            {
                Assert.Equal(0, task);
                continue;
            }

            double after = onBoard + t.Demand;
            Assert.Equal(after, load, 6);
            Assert.True(after <= capacity && after >= 0, $"load {after} after task {task}");
            Assert.True(served.TryAdd(task, (vehicle, int.Parse(f[Col("sequence")], CultureInfo.InvariantCulture))), $"task {task} served twice");
            previous[vehicle] = (task, Math.Max(arrival, t.Earliest) + t.Service, after);
        }

        Assert.Equal(tasks.Count - 1, served.Count);
        foreach (var (task, t) in tasks)
        {
            if (t.Delivery > 0)
            {
                var pickup = served[task];
                var delivery = served[t.Delivery];
                Assert.Equal(pickup.Vehicle, delivery.Vehicle);
                Assert.True(pickup.Sequence < delivery.Sequence, $"task {t.Delivery} delivered before its pickup {task}");
            }
        }
    }

    private static Dictionary<int, (double X, double Y, double Demand, double Earliest, double Latest, double Service, int Delivery)> Tasks(string file, out double capacity)
    {
        var lines = File.ReadAllLines(file).Where(l => l.Trim().Length > 0).ToArray();
        capacity = double.Parse(lines[0].Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries)[1], CultureInfo.InvariantCulture);
        var tasks = new Dictionary<int, (double, double, double, double, double, double, int)>();
        foreach (var line in lines.Skip(1))
        {
            var v = line.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries).Select(x => double.Parse(x, CultureInfo.InvariantCulture)).ToArray();
            tasks[(int)v[0]] = (v[1], v[2], v[3], v[4], v[5], v[6], (int)v[8]);
        }

        return tasks;
    }
}
