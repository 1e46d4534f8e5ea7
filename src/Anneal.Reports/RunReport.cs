using Anneal.Core.Evaluation;
using Anneal.Core.Model;
using Anneal.Reports.Html;
using Anneal.Reports.Plots;
using Anneal.Formats.Output.Runs;
using Anneal.Reports.Traces;
using Anneal.Core.Solving;

namespace Anneal.Reports;

/// <summary>
/// Front door: draws a run folder's pictures (convergence, routes, schedule; PNG and SVG) and report.html from
/// run.json, trace.csv and the plan judged on the instance. Fresh runs and `anneal plot` both come through here,
/// from the same files, so a redraw gives the same pictures.
/// </summary>
public static class RunReport
{
    /// <summary>Every file this writes, relative to the run folder.</summary>
    public static IReadOnlyList<string> Files { get; } =
    [
        ConvergencePlot.FileStem + ".png", ConvergencePlot.FileStem + ".svg", RouteMap.FileStem + ".png", RouteMap.FileStem + ".svg",
        ScheduleChart.FileStem + ".png", ScheduleChart.FileStem + ".svg", ReportPage.FileName,
    ];

    /// <param name="replan">A re-plan's residual day and changes, for its section of the report; null otherwise.</param>
    public static void Write(string folder, Instance instance, PlanEvaluation evaluation, (Core.Replanning.ResidualDay, Core.Replanning.DayChanges)? replan = null)
    {
        var record = RunRecordFile.Read(Path.Combine(folder, RunRecordFile.FileName));
        var solvers = Solvers(record, ReadTraces(folder));
        byte[]? convergence = WriteConvergence(folder, solvers, record.Chosen);
        byte[]? routes = null, schedule = null;
        if (evaluation.VehiclesUsed > 0 || evaluation.Unserved.Count > 0)
        {
            using var map = RouteMap.Create(instance, evaluation);
            routes = PlotFile.Save(map, folder, RouteMap.FileStem, RouteMap.Size);
        }

        if (evaluation.VehiclesUsed > 0)
        {
            using var chart = ScheduleChart.Create(instance, evaluation);
            schedule = PlotFile.Save(chart, folder, ScheduleChart.FileStem, ScheduleChart.SizeFor(evaluation));
        }

        var input = new ReportInput(instance, evaluation, record, solvers, new ReportPictures(convergence, routes, schedule)) { Replan = replan };
        ReportPage.Write(Path.Combine(folder, ReportPage.FileName), input);
    }

    /// <summary>Only the convergence plot, which needs no instance (the fallback when the input has moved).</summary>
    public static byte[]? WriteConvergence(string folder)
    {
        var record = RunRecordFile.Read(Path.Combine(folder, RunRecordFile.FileName));
        return WriteConvergence(folder, Solvers(record, ReadTraces(folder)), record.Chosen);
    }

    private static byte[]? WriteConvergence(string folder, IReadOnlyList<SolverRun> solvers, string? chosen)
    {
        if (solvers.Count == 0)
        {
            return null;
        }

        using var plot = ConvergencePlot.Create(solvers, chosen);
        return PlotFile.Save(plot, folder, ConvergencePlot.FileStem, ConvergencePlot.Size);
    }

    private static IReadOnlyDictionary<string, IReadOnlyList<TracePoint>> ReadTraces(string folder)
    {
        string path = Path.Combine(folder, Formats.Output.TraceCsvWriter.FileName);
        return File.Exists(path) ? TraceCsvReader.Read(path) : new Dictionary<string, IReadOnlyList<TracePoint>>();
    }

    private static List<SolverRun> Solvers(RunRecord record, IReadOnlyDictionary<string, IReadOnlyList<TracePoint>> traces)
    {
        var list = new List<SolverRun>(record.Solvers.Count);
        foreach (var s in record.Solvers)
        {
            list.Add(new SolverRun(s.Solver, s.Objective, s.Feasible, s.Vehicles, s.Distance, s.Seconds, s.SecondsToBest, s.Status, s.LowerBound, s.Notes,
                traces.TryGetValue(s.Solver, out var t) ? t : [], s.BoundOnly));
        }

        return list;
    }
}
