using System.Globalization;
using Anneal.Core.Evaluation;
using Anneal.Core.Model;

namespace Anneal.Formats.Output;

/// <summary>routes.csv: one row per visit, in route order, with the evaluator's schedule and the load left on board.</summary>
public static class RoutesCsvWriter
{
    public const string FileName = "routes.csv";

    public static void Write(string path, Instance instance, PlanEvaluation evaluation) =>
        AtomicFile.WriteText(path, writer => Write(writer, instance, evaluation));

    public static void Write(TextWriter writer, Instance instance, PlanEvaluation evaluation)
    {
        using var csv = CsvOutput.Open(writer);
        foreach (var name in new[] { "vehicle", "sequence", "stop", "arrival", "start", "departure", "wait", "late", "window" })
        {
            csv.WriteField(name);
        }

        foreach (var dim in instance.DimensionNames)
        {
            csv.WriteField("load_" + dim);
        }

        csv.NextRecord();
        foreach (var route in evaluation.Routes)
        {
            string vehicle = instance.Vehicles[route.Vehicle].Id;
            for (int k = 0; k < route.Stops.Length; k++)
            {
                var stop = instance.Stops[route.Stops[k]];
                var visit = route.Visits[k];
                csv.WriteField(vehicle);
                csv.WriteField((k + 1).ToString(CultureInfo.InvariantCulture));
                csv.WriteField(stop.Id);
                csv.WriteField(instance.Units.Format(visit.Arrival));
                csv.WriteField(instance.Units.Format(visit.Start));
                csv.WriteField(instance.Units.Format(visit.Departure));
                csv.WriteField(TimeText.Number(visit.Wait));
                csv.WriteField(TimeText.Number(visit.Late));
                csv.WriteField(TimeText.Window(instance, WindowUsed(stop, visit.Arrival)));
                foreach (double load in route.LoadAfter[k])
                {
                    csv.WriteField(TimeText.Amount(load));
                }

                csv.NextRecord();
            }
        }

        csv.Flush();
    }

    /// <summary>The window the scheduler served in: the first still open on arrival, else the last (served late).</summary>
    public static TimeWindow WindowUsed(Stop stop, double arrival)
    {
        foreach (var w in stop.Windows)
        {
            if (w.Close >= arrival)
            {
                return w;
            }
        }

        return stop.Windows.Length > 0 ? stop.Windows[^1] : TimeWindow.Always;
    }
}
