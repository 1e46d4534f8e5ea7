using System.Diagnostics;
using System.Globalization;
using System.Text;
using Anneal.Core.Solving;

namespace Anneal.Cli.Reporting;

/// <summary>
/// Shows the solvers' progress on stderr. On a terminal: a small table (solver, best objective, feasible, elapsed,
/// time left) redrawn in place with ANSI cursor movement. Otherwise (a log file, CI): plain lines, at most one per
/// solver every <see cref="LogEverySeconds"/> of solver time. Solvers report from their own threads, hence the lock.
/// </summary>
public sealed class ProgressReporter
{
    public const double LogEverySeconds = 2.0;

    // Redrawing faster than this only flickers.
    private const long RedrawMilliseconds = 100;

    // ESC [ n F: cursor to the start of the line n lines up; ESC [ 2K: clear that whole line.
    private const string ClearLine = "\u001b[2K";

    private readonly TextWriter _writer;
    private readonly bool _terminal;
    private readonly TimeSpan? _budget;
    private readonly Lock _lock = new();
    private readonly Dictionary<string, TracePoint> _latest = new(StringComparer.Ordinal);
    private readonly List<string> _order = [];
    private readonly Dictionary<string, double> _lastLogged = new(StringComparer.Ordinal);
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private long _lastDraw = -RedrawMilliseconds;
    private int _linesDrawn;

    /// <param name="budget">The run's time limit, for the time-left column; null leaves it empty.</param>
    public ProgressReporter(TextWriter writer, bool terminal, TimeSpan? budget = null)
    {
        _writer = writer;
        _terminal = terminal;
        _budget = budget;
    }

    public void Report(string solver, TracePoint point)
    {
        lock (_lock)
        {
            if (!_latest.ContainsKey(solver))
            {
                _order.Add(solver);
            }

            _latest[solver] = point;
            if (_terminal)
            {
                long now = _clock.ElapsedMilliseconds;
                if (now - _lastDraw >= RedrawMilliseconds)
                {
                    _lastDraw = now;
                    Draw();
                }
            }
            else if (!_lastLogged.TryGetValue(solver, out double last) || point.Seconds - last >= LogEverySeconds)
            {
                _lastLogged[solver] = point.Seconds;
                _writer.WriteLine(BoundTrace.Is(point)
                    ? string.Create(CultureInfo.InvariantCulture, $"[{point.Seconds,7:0.0} s] {solver}: {point.State} {point.BestObjective:0.00}")
                    : string.Create(CultureInfo.InvariantCulture,
                        $"[{point.Seconds,7:0.0} s] {solver}: best {point.BestObjective:0.00} ({Feasibility(point)}), current {point.CurrentObjective:0.00}, iteration {point.Iteration}{State(point)}"));
            }
        }
    }

    /// <summary>Draws the table a last time and leaves the cursor below it, so that what follows starts on a fresh line.</summary>
    public void Finish()
    {
        lock (_lock)
        {
            if (_terminal && _order.Count > 0)
            {
                Draw();
            }

            _writer.Flush();
        }
    }

    /// <summary>The table as lines (without escapes), for the terminal and for tests.</summary>
    public IReadOnlyList<string> Table()
    {
        lock (_lock)
        {
            return Lines();
        }
    }

    private List<string> Lines()
    {
        double elapsed = _clock.Elapsed.TotalSeconds;
        string left = _budget is { } b ? Secs(Math.Max(0, b.TotalSeconds - elapsed)) : "–";
        var lines = new List<string>(_order.Count + 1)
        {
            string.Create(CultureInfo.InvariantCulture, $"{"solver",-12} {"best objective",16} {"feasible",-9} {"elapsed",9} {"left",9}"),
        };
        foreach (var name in _order)
        {
            var p = _latest[name];
            lines.Add(string.Create(CultureInfo.InvariantCulture,
                $"{Cut(name, 12),-12} {p.BestObjective,16:0.00} {(BoundTrace.Is(p) ? "bound" : p.BestFeasible ? "yes" : "no"),-9} {Secs(elapsed),9} {left,9}"));
        }

        return lines;
    }

    private void Draw()
    {
        var lines = Lines();
        int width = Width() - 1;
        var text = new StringBuilder();
        if (_linesDrawn > 0)
        {
            text.Append(CultureInfo.InvariantCulture, $"\u001b[{_linesDrawn}F");
        }

        foreach (var line in lines)
        {
            text.Append(ClearLine).Append(line.Length > width ? line[..width] : line).Append('\n');
        }

        _linesDrawn = lines.Count;
        _writer.Write(text.ToString());
        _writer.Flush();
    }

    private static string Secs(double s) => s.ToString("0.0", CultureInfo.InvariantCulture) + " s";

    private static string Cut(string s, int n) => s.Length > n ? s[..n] : s;

    private static int Width()
    {
        try
        {
            int w = Console.WindowWidth;
            return w > 20 ? w : 120;
        }
        catch (IOException)
        {
            return 120;
        }
    }

    private static string Feasibility(TracePoint p) => p.BestFeasible ? "feasible" : "infeasible";

    private static string State(TracePoint p) => string.IsNullOrEmpty(p.State) ? string.Empty : ", " + p.State;
}
