using System.Text.Json;

namespace Anneal.Tests.Worker;

/// <summary>A temporary folder holding a worker's inbox, outbox, working and failed folders, and what tests check in them.</summary>
public abstract class WorkerTest : TempFolderTest
{
    protected string Inbox => Path.Combine(Dir, "inbox");

    protected string Outbox => Path.Combine(Dir, "outbox");

    protected string Working => Path.Combine(Dir, "working");

    protected string Failed => Path.Combine(Dir, "failed");

    protected void WaitUntilSolving(WorkerProcess worker)
    {
        var deadline = DateTime.UtcNow.AddSeconds(30);
        while (DateTime.UtcNow < deadline)
        {
            foreach (var file in Directory.Exists(Working) ? Directory.GetFiles(Working, "*.status.json") : [])
            {
                try
                {
                    if (Json(file).GetProperty("running").EnumerateArray().Any(j => j.GetProperty("solvers").GetArrayLength() > 0))
                    {
                        return;
                    }
                }
                catch (Exception e) when (e is IOException or JsonException)
                {
                    // Replaced while being read; look again.
                }
            }

            Thread.Sleep(100);
        }

        Assert.Fail("the worker never reported a running solver; its log:\n" + worker.Log);
    }

    protected static void AssertComplete(string folder, bool interrupted)
    {
        foreach (var file in new[] { "routes.csv", "summary.json", "trace.csv", "job.json" })
        {
            Assert.True(File.Exists(Path.Combine(folder, file)), $"{file} is missing in {folder}, which holds {string.Join(", ", Directory.GetFileSystemEntries(folder).Select(Path.GetFileName))}");
        }

        Assert.Equal(interrupted, Json(Path.Combine(folder, "summary.json")).GetProperty("interrupted").GetBoolean());
    }

    /// <summary>No job left in the inbox or a worker's folder, and no partial folder anywhere.</summary>
    protected void AssertNothingLeft()
    {
        Assert.Empty(Directory.GetFileSystemEntries(Inbox));
        Assert.Empty(Directory.GetDirectories(Working));
        Assert.Empty(Directory.GetFiles(Working, "*.lock"));
        Assert.Empty(Directory.GetDirectories(Outbox, ".*"));
        Assert.Empty(Directory.GetDirectories(Failed, ".*"));
    }

    protected static JsonElement Record(string folder) => Json(Path.Combine(folder, "job.json"));

    protected static JsonElement Json(string path)
    {
        using var document = JsonDocument.Parse(File.ReadAllBytes(path));
        return document.RootElement.Clone();
    }

    protected static string[] Names(string folder) =>
        Directory.Exists(folder)
            ? Directory.GetFileSystemEntries(folder).Select(p => Path.GetFileName(p)).Where(n => !n.StartsWith('.')).Order(StringComparer.Ordinal).ToArray()
            : [];
}
