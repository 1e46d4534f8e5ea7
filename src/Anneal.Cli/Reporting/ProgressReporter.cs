using System.Diagnostics;
using System.Globalization;
using System.Text;
using Anneal.Search.Running;

namespace Anneal.Cli.Reporting;

/// <summary>
/// Shows the solvers' progress on stderr. On a terminal: one status line redrawn in place (carriage return).
/// Otherwise (a log file, CI): plain lines, at most one per solver every <see cref="LogEverySeconds"/> of solver time.
/// Solvers report from their own threads, hence the lock.
/// </summary>
public sealed class ProgressReporter
{
    public const double LogEverySeconds = 2.0;

    // Redrawing faster than this only flickers.
    private const long RedrawMilliseconds = 100;

    private readonly TextWriter _writer;
    private readonly bool _terminal;
    private readonly Lock _lock = new();
    private readonly Dictionary<string, TracePoint> _latest = new(StringComparer.Ordinal);
    private readonly List<string> _order = [];
    private readonly Dictionary<string, double> _lastLogged = new(StringComparer.Ordinal);
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private long _lastDraw = -RedrawMilliseconds;
    private int _lineLength;

    public ProgressReporter(TextWriter writer, bool terminal)
    {
        _writer = writer;
        _terminal = terminal;
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
                _writer.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"[{point.Seconds,7:0.0} s] {solver}: best {point.BestObjective:0.00} ({Feasibility(point)}), current {point.CurrentObjective:0.00}, iteration {point.Iteration}{State(point)}"));
            }
        }
    }

    /// <summary>Ends the status line so that what follows starts on a fresh line.</summary>
    public void Finish()
    {
        lock (_lock)
        {
            if (_terminal && _order.Count > 0)
            {
                Draw();
                _writer.WriteLine();
            }

            _writer.Flush();
        }
    }

    private void Draw()
    {
        var line = new StringBuilder();
        line.Append(CultureInfo.InvariantCulture, $"{_clock.Elapsed.TotalSeconds,6:0.0} s");
        foreach (var name in _order)
        {
            var p = _latest[name];
            line.Append(CultureInfo.InvariantCulture, $" | {name} {p.BestObjective:0.00}{(p.BestFeasible ? string.Empty : " (infeasible)")}");
        }

        int width = Width() - 1;
        string text = line.Length > width ? line.ToString(0, width) : line.ToString();
        _writer.Write("\r" + text.PadRight(_lineLength));
        _lineLength = text.Length;
        _writer.Flush();
    }

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
