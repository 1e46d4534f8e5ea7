using System.Globalization;
using Anneal.Core.Solving;

namespace Anneal.Worker.Isolation;

/// <summary>
/// What the solver process (<c>anneal run-job</c>) tells the worker on its standard output, one tab-separated line
/// per event: a solver begins or ends, a solver improved (a trace point), the run is done and its files are written.
/// Everything the worker knows of a crashed run comes from these lines and the exit status.
/// </summary>
public static class ChildProtocol
{
    public const string Begin = "begin";
    public const string End = "end";
    public const string Point = "point";
    public const string Done = "done";
    public const string NoSpace = "nospace";

    public static string BeginLine(string solver) => $"{Begin}\t{Clean(solver)}";

    public static string EndLine(string solver) => $"{End}\t{Clean(solver)}";

    public static string PointLine(string solver, TracePoint p) => string.Create(CultureInfo.InvariantCulture,
        $"{Point}\t{Clean(solver)}\t{p.Seconds:R}\t{p.Iteration}\t{p.BestObjective:R}\t{p.CurrentObjective:R}\t{(p.BestFeasible ? 1 : 0)}\t{Clean(p.State)}");

    public static string DoneLine(ChildResult r) => string.Create(CultureInfo.InvariantCulture,
        $"{Done}\t{(r.Interrupted ? 1 : 0)}\t{Clean(r.Solver)}\t{r.Objective:R}\t{(r.Feasible ? 1 : 0)}\t{r.Vehicles}");

    public static string NoSpaceLine(string reason) => $"{NoSpace}\t{Clean(reason)}";

    /// <summary>Reads one line into <paramref name="events"/>; lines it does not know are ignored.</summary>
    public static void Read(string line, IChildEvents events)
    {
        var f = line.Split('\t');
        try
        {
            switch (f[0])
            {
                case Begin when f.Length == 2:
                    events.Began(f[1]);
                    break;
                case End when f.Length == 2:
                    events.Ended(f[1]);
                    break;
                case Point when f.Length == 8:
                    events.Improved(f[1], new TracePoint(Number(f[2]), long.Parse(f[3], CultureInfo.InvariantCulture), Number(f[4]), Number(f[5]), f[6] == "1", f[7]));
                    break;
                case NoSpace when f.Length == 2:
                    events.OutOfSpace(f[1]);
                    break;
                case Done when f.Length == 6:
                    events.Finished(new ChildResult(f[1] == "1", f[2], Number(f[3]), f[4] == "1", int.Parse(f[5], CultureInfo.InvariantCulture)));
                    break;
            }
        }
        catch (FormatException)
        {
            // A torn or foreign line says nothing reliable.
        }
    }

    private static double Number(string text) => double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture);

    private static string Clean(string text) => text.Replace('\t', ' ').Replace('\n', ' ').Replace('\r', ' ');
}

/// <summary>The chosen plan of a finished run, as the solver process reports it.</summary>
public sealed record ChildResult(bool Interrupted, string Solver, double Objective, bool Feasible, int Vehicles);

/// <summary>Receives the solver process's events as they are read.</summary>
public interface IChildEvents
{
    void Began(string solver);

    void Ended(string solver);

    void Improved(string solver, TracePoint point);

    void Finished(ChildResult result);

    /// <summary>The run's files could not be written: the disk is full.</summary>
    void OutOfSpace(string reason);
}
