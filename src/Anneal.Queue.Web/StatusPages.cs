using System.Globalization;
using Anneal.Formats.Output;
using Anneal.Queue.Jobs;

namespace Anneal.Queue.Web;

/// <summary>The status page's HTML, rendered on the server from one snapshot of the queue; no script, no client framework.</summary>
internal static class StatusPages
{
    public const int RefreshSeconds = 5;

    private const string Style = """
        body { font: 14px/1.4 system-ui, sans-serif; margin: 1.5rem; color: #1d2430; }
        h1 { font-size: 1.4rem; } h2 { font-size: 1.1rem; margin-top: 1.6rem; }
        table { border-collapse: collapse; } th, td { padding: .25rem .6rem; border-bottom: 1px solid #d8dde6; text-align: left; vertical-align: top; }
        td.n { text-align: right; font-variant-numeric: tabular-nums; }
        #counts { display: flex; gap: 1rem; list-style: none; padding: 0; }
        #counts li { border: 1px solid #d8dde6; border-radius: 6px; padding: .5rem 1rem; min-width: 6rem; }
        #counts b { display: block; font-size: 1.6rem; }
        .failed { color: #a01919; } .muted { color: #667085; }
        footer { margin-top: 2rem; font-size: 12px; color: #667085; }
        """;

    public static string Overview(QueueStatus s, DateTimeOffset now)
    {
        var h = new Html();
        h.Raw("<ul id=\"counts\">");
        foreach (var (state, n) in new[] { ("queued", s.Queued), ("running", s.Running), ("done", s.Done), ("failed", s.Failed) })
        {
            h.Raw($"<li id=\"count-{state}\"><b>{n.ToString(CultureInfo.InvariantCulture)}</b>{state}</li>");
        }

        h.Raw("</ul>\n<h2>Running</h2>\n");
        if (s.RunningJobs.Count == 0)
        {
            h.Raw("<p class=\"muted\">No job is running.</p>\n");
        }
        else
        {
            h.Raw("<table id=\"running\"><tr><th>job</th><th>name</th><th>worker</th><th>attempt</th><th>elapsed</th><th>best so far</th><th>lease until</th></tr>\n");
            foreach (var j in s.RunningJobs)
            {
                h.Row(JobLink(j.Id), Html.Encode(j.Name), Html.Encode(j.Worker), Html.Number(j.Attempt, "0"), Html.Number(j.ElapsedSeconds, "0.0") + " s",
                    Best(j.Solvers), Html.Time(j.LeaseUntil));
            }

            h.Raw("</table>\n");
        }

        h.Raw("<h2>Failed</h2>\n");
        if (s.FailedJobs.Count == 0)
        {
            h.Raw("<p class=\"muted\">No job has failed.</p>\n");
        }
        else
        {
            h.Raw("<table id=\"failed\"><tr><th>job</th><th>name</th><th>attempts</th><th>finished</th><th>reason</th></tr>\n");
            foreach (var f in s.FailedJobs)
            {
                h.Row(JobLink(f.Id), Html.Encode(f.Name), Html.Number(f.Attempt, "0"), Html.Time(f.FinishedAt), "<span class=\"failed\">" + Html.Encode(f.Reason) + "</span>");
            }

            h.Raw("</table>\n");
        }

        h.Raw("<h2>Done (latest)</h2>\n");
        if (s.DoneJobs.Count == 0)
        {
            h.Raw("<p class=\"muted\">No job is done yet.</p>\n");
        }
        else
        {
            h.Raw("<table id=\"done\"><tr><th>job</th><th>name</th><th>chosen</th><th>objective</th><th>vehicles</th><th>feasible</th><th>finished</th><th>report</th></tr>\n");
            foreach (var d in s.DoneJobs)
            {
                h.Row(JobLink(d.Id), Html.Encode(d.Name), Html.Encode(d.Solver), Html.Number(d.Objective), Html.Number(d.Vehicles, "0"),
                    (d.Feasible ? "yes" : "<span class=\"failed\">no</span>") + (d.Interrupted ? " (interrupted)" : string.Empty), Html.Time(d.FinishedAt),
                    $"<a href=\"{FileUrl(d.Id, "report.html")}\">report.html</a>");
            }

            h.Raw("</table>\n");
        }

        return Page("Anneal queue", h.ToString(), now, RefreshSeconds);
    }

    public static string Job(JobOverview job, IReadOnlyList<(string Name, string MediaType, long Bytes)> files, IReadOnlyList<JobEvent> events, DateTimeOffset now)
    {
        var h = new Html();
        h.Raw("<p><a href=\"/\">&larr; all jobs</a></p>\n<table id=\"job\">");
        h.Row("state", Html.Encode(job.State) + (job.Interrupted ? " (its stored plan was interrupted)" : string.Empty));
        h.Row("attempt", Html.Number(job.Attempt, "0"));
        h.Row("finished", Html.Time(job.FinishedAt));
        if (job.Error is { Length: > 0 } error)
        {
            h.Row("reason", "<span class=\"failed\">" + Html.Encode(error) + "</span>");
        }

        h.Raw("</table>\n<h2>Files</h2>\n");
        if (files.Count == 0)
        {
            h.Raw("<p class=\"muted\">No result is stored for this job.</p>\n");
        }
        else
        {
            h.Raw("<table id=\"files\"><tr><th>file</th><th>bytes</th></tr>\n");
            foreach (var f in files)
            {
                h.Row($"<a href=\"{FileUrl(job.Id, f.Name)}\">{Html.Encode(f.Name)}</a>", Html.Number(f.Bytes, "0"));
            }

            h.Raw("</table>\n");
        }

        h.Raw("<h2>History</h2>\n<table id=\"events\"><tr><th>when</th><th>claim</th><th>worker</th><th>event</th><th>detail</th></tr>\n");
        foreach (var e in events)
        {
            h.Row(Html.Time(e.At), Html.Number(e.Claim, "0"), Html.Encode(e.Worker), Html.Encode(e.Event), Html.Encode(e.Detail));
        }

        h.Raw("</table>\n");
        return Page($"Job {job.Id.ToString(CultureInfo.InvariantCulture)}: {job.Name}", h.ToString(), now, job.State is "queued" or "running" ? RefreshSeconds : null);
    }

    public static string Problem(string title, string message, DateTimeOffset now) =>
        Page(title, "<p><a href=\"/\">&larr; all jobs</a></p><p class=\"failed\">" + Html.Encode(message) + "</p>", now, RefreshSeconds);

    private static string Page(string title, string body, DateTimeOffset now, int? refresh)
    {
        var h = new Html();
        h.Raw("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">");
        if (refresh is { } seconds)
        {
            h.Raw($"<meta http-equiv=\"refresh\" content=\"{seconds.ToString(CultureInfo.InvariantCulture)}\">");
        }

        h.Raw("<title>").Text(title).Raw("</title><style>").Raw(Style).Raw("</style></head><body>\n<h1>").Text(title).Raw("</h1>\n");
        h.Raw($"<p class=\"muted\">As of {Html.Time(now)}{(refresh is null ? string.Empty : $"; refreshes every {refresh.Value.ToString(CultureInfo.InvariantCulture)} s")}. Read-only.</p>\n");
        h.Raw(body);
        h.Raw("<footer><ul>");
        foreach (var caution in Cautions.All)
        {
            h.Raw("<li>").Text(caution).Raw("</li>");
        }

        h.Raw("</ul></footer>\n</body></html>\n");
        return h.ToString();
    }

    private static string JobLink(long id)
    {
        string n = id.ToString(CultureInfo.InvariantCulture);
        return $"<a href=\"/jobs/{n}\">{n}</a>";
    }

    private static string FileUrl(long id, string name) =>
        $"/jobs/{id.ToString(CultureInfo.InvariantCulture)}/files/{string.Join('/', name.Split('/').Select(Uri.EscapeDataString))}";

    private static string Best(IReadOnlyList<SolverProgress> solvers)
    {
        if (solvers.Count == 0)
        {
            return "<span class=\"muted\">starting</span>";
        }

        return string.Join("<br>", solvers.Select(p =>
            $"{Html.Encode(p.Solver)} {Html.Number(p.BestObjective)} ({(p.Feasible ? "feasible" : "<span class=\"failed\">infeasible</span>")}, {Html.Number(p.Seconds, "0.0")} s)"));
    }
}
