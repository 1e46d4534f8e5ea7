using System.Runtime.InteropServices;
using System.Text.Json;
using System.Text.Json.Nodes;
using Anneal.Formats.Output;

namespace Anneal.Experiments.Summary;

/// <summary>
/// Where and when an experiment ran. machine.json keeps one entry per invocation, so that a benchmark resumed on
/// another machine says so.
/// </summary>
public sealed record MachineInfo(int ProcessorCount, string Os, string Architecture, string Runtime, DateTimeOffset Date, int Jobs)
{
    public const string FileName = "machine.json";

    public static MachineInfo Current(int jobs, DateTimeOffset now) => new(Environment.ProcessorCount, RuntimeInformation.OSDescription,
        RuntimeInformation.OSArchitecture.ToString(), RuntimeInformation.FrameworkDescription, now, jobs);

    public bool Oversubscribed => Jobs > ProcessorCount;

    public string Line() =>
        $"Anneal {ToolVersion.Text}; {ProcessorCount} processors ({Architecture}), {Os}, {Runtime}, {Date:yyyy-MM-dd HH:mm zzz}; {Jobs} run(s) at a time"
        + (Oversubscribed ? " — more runs than processors, so the solvers shared cores and their timings are not fair" : ", one solver per core");

    /// <summary>Adds this invocation to machine.json in <paramref name="folder"/> (written atomically).</summary>
    public void Append(string folder)
    {
        string path = Path.Combine(folder, FileName);
        var runs = new JsonArray();
        try
        {
            if (File.Exists(path) && JsonNode.Parse(File.ReadAllText(path))?["invocations"] is JsonArray earlier)
            {
                foreach (var node in earlier)
                {
                    runs.Add(node?.DeepClone());
                }
            }
        }
        catch (JsonException)
        {
            // An unreadable machine.json is replaced: it describes, it is not needed to resume.
        }

        runs.Add(new JsonObject
        {
            ["processorCount"] = ProcessorCount,
            ["os"] = Os,
            ["architecture"] = Architecture,
            ["runtime"] = Runtime,
            ["date"] = Date.ToString("o", System.Globalization.CultureInfo.InvariantCulture),
            ["jobs"] = Jobs,
            ["annealVersion"] = ToolVersion.Version,
            ["commit"] = ToolVersion.Commit,
        });
        var root = new JsonObject { ["invocations"] = runs };
        AtomicFile.WriteText(path, w => w.Write(root.ToJsonString(new JsonSerializerOptions { WriteIndented = true, Encoder = JsonText.Encoder })));
    }
}
