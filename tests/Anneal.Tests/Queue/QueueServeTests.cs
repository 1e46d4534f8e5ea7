using System.Globalization;
using System.Net;
using System.Text.Json;
using Anneal.Tests.Worker;

namespace Anneal.Tests.Queue;

/// <summary>
/// `anneal queue serve` (issue 25) as a real process, looked at in a real headless Chromium (as the report's browser
/// test does): counts by state, the running job with its worker and best so far, the failed job with its reason,
/// the done job's report served from the database, /health; read-only, and no connection string on any page.
/// </summary>
public sealed class QueueServeTests(PostgresCluster cluster) : QueueTest(cluster)
{
    private const string Password = "Lantern-Cove-19";

    [SkippableFact]
    public void The_status_page_shows_the_queue_and_serves_each_report_from_the_database_and_accepts_no_writes()
    {
        string? browser = Chromium.Find();
        Skip.If(browser is null, Chromium.Missing);
        Init();
        long done = Submit(WorkerJobs.WriteValid(Path.Combine(Dir, "north"), 1))[0];
        using (var worker = WorkerProcess.Launch(Dir, ["worker", "--db", Db, "--once"], new Dictionary<string, string>()))
        {
            Assert.True(worker.WaitForExit(60) == 0, worker.Log);
        }

        var later = Submit(WorkerJobs.WriteValid(Path.Combine(Dir, "quay"), 2), WorkerJobs.WriteValid(Path.Combine(Dir, "south"), 3), WorkerJobs.WriteValid(Path.Combine(Dir, "east"), 4));
        long failed = later[0], running = later[1];

        // The two other states as a worker leaves them; the reason holds markup, which the page must show as text.
        Execute($"UPDATE jobs SET state = 'failed', attempt = 3, finished_at = now(), error = 'Given up after 3 attempts: <b>out of memory</b>' WHERE id = {failed}");
        Execute($$"""
            UPDATE jobs SET state = 'running', claim = 1, worker = 'depot7-4242-cafe0001', claimed_at = now() - interval '42 seconds',
                            lease_until = now() + interval '1 minute',
                            progress = '[{"solver":"sa","bestObjective":1234.5,"feasible":true,"seconds":41.5,"iteration":900}]'
            WHERE id = {{running}}
            """);

        int port = PostgresCluster.FreePort();
        string site = $"http://127.0.0.1:{port.ToString(CultureInfo.InvariantCulture)}";
        using var serve = WorkerProcess.Launch(Dir, ["queue", "serve", "--db", Db + ";Password=" + Password, "--urls", site], new Dictionary<string, string>());
        using var http = new HttpClient { Timeout = TimeSpan.FromSeconds(10) };
        var health = WaitForHealth(http, site + "/health", serve);
        Assert.Equal("ok", health.GetProperty("status").GetString());

        // Read-only: there is nothing to post to.
        using (var post = http.PostAsync(site + "/", new StringContent("x")).Result)
        {
            Assert.Equal(HttpStatusCode.MethodNotAllowed, post.StatusCode);
        }

        string shot = Path.Combine(Dir, "status.png");
        Chromium.Run(browser!, $"--screenshot={shot} --window-size=1280,1000 {site}/", Dir);
        string dom = Chromium.Run(browser!, $"--dump-dom {site}/", Dir);
        Fixtures.PngCheck.Valid(File.ReadAllBytes(shot), 1280, 1000);

        Assert.Contains("<li id=\"count-queued\"><b>1</b>queued</li>", dom, StringComparison.Ordinal);
        Assert.Contains("<li id=\"count-running\"><b>1</b>running</li>", dom, StringComparison.Ordinal);
        Assert.Contains("<li id=\"count-done\"><b>1</b>done</li>", dom, StringComparison.Ordinal);
        Assert.Contains("<li id=\"count-failed\"><b>1</b>failed</li>", dom, StringComparison.Ordinal);
        Assert.Contains("depot7-4242-cafe0001", dom, StringComparison.Ordinal);
        Assert.Contains("sa 1234.50 (feasible, 41.5 s)", dom, StringComparison.Ordinal);
        Assert.Contains("&lt;b&gt;out of memory&lt;/b&gt;", dom, StringComparison.Ordinal);
        Assert.DoesNotContain("<b>out of memory</b>", dom, StringComparison.Ordinal);
        Assert.Contains("http-equiv=\"refresh\"", dom, StringComparison.Ordinal);
        Assert.Contains($"href=\"/jobs/{done}/files/report.html\"", dom, StringComparison.Ordinal);

        // The done job's report comes from the database and renders as the report does from a run folder.
        string report = Chromium.Run(browser!, $"--dump-dom {site}/jobs/{done}/files/report.html", Dir);
        Assert.Contains("id=\"solver-table\"", report, StringComparison.Ordinal);
        string job = Chromium.Run(browser!, $"--dump-dom {site}/jobs/{done}", Dir);
        Assert.Contains("routes.csv", job, StringComparison.Ordinal);
        Assert.Contains("claimed", job, StringComparison.Ordinal);
        using (var missing = http.GetAsync($"{site}/jobs/{done}/files/nothing.csv").Result)
        {
            Assert.Equal(HttpStatusCode.NotFound, missing.StatusCode);
        }

        foreach (var page in new[] { dom, report, job, serve.Log })
        {
            Assert.DoesNotContain(Password, page, StringComparison.Ordinal);
            Assert.DoesNotContain("Username=", page, StringComparison.Ordinal);
        }

        serve.Terminate();
        Assert.True(serve.WaitForExit(30) == 130, serve.Log);
    }

    private long[] Submit(params string[] paths)
    {
        var (code, output, err) = Anneal(["queue", "submit", "--db", Db, "--time", "5", "--iterations", "500", "--solvers", "sa", .. paths]);
        Assert.True(code == 0, err);
        return output.Split('\n', StringSplitOptions.RemoveEmptyEntries).Select(long.Parse).ToArray();
    }

    private static JsonElement WaitForHealth(HttpClient http, string url, WorkerProcess serve)
    {
        var deadline = DateTime.UtcNow.AddSeconds(60);
        while (DateTime.UtcNow < deadline && !serve.HasExited)
        {
            try
            {
                using var response = http.GetAsync(url).Result;
                using var doc = JsonDocument.Parse(response.Content.ReadAsStringAsync().Result);
                return doc.RootElement.Clone();
            }
            catch (AggregateException e) when (e.InnerException is HttpRequestException or TaskCanceledException)
            {
                Thread.Sleep(200);
            }
        }

        Assert.Fail("the status page never answered; its log:\n" + serve.Log);
        return default;
    }
}
