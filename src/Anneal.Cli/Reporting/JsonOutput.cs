using System.CommandLine;
using System.Text.Json;
using System.Text.Json.Nodes;
using Anneal.Formats.Input;
using Anneal.Formats.Output;

namespace Anneal.Cli.Reporting;

/// <summary>
/// `--json` on check, evaluate and solve: one JSON document on stdout and nothing else. Every document has
/// `exitCode`, `error` (null, or what went wrong in a sentence) and `problems` (the input's problems, else empty);
/// solve and evaluate add summary.json's fields, check what it read. Field names are the README's contract.
/// </summary>
public static class JsonOutput
{
    public const string OptionName = "--json";

    public static Option<bool> Option() => new(OptionName)
    {
        Description = "Print one JSON document on stdout and nothing else (the usual text goes to stderr); see the README's '--json'.",
    };

    /// <summary>The context a command runs in: with --json its text goes to stderr and its document to stdout.</summary>
    public static CliContext For(CliContext context, bool json) => json ? context with { Out = context.Err, Json = context.Out } : context;

    /// <summary>Whether the command line asks for JSON (also when it has other mistakes, so that they come as JSON).</summary>
    public static bool Requested(ParseResult? parsed, IReadOnlyList<string> args)
    {
        if (parsed is null || !args.Contains(OptionName))
        {
            return false;
        }

        foreach (var option in parsed.CommandResult.Command.Options)
        {
            if (option.Name == OptionName)
            {
                return true;
            }
        }

        return false;
    }

    /// <summary>A document for a command that could not do its work.</summary>
    public static JsonObject Error(int exitCode, string error, IReadOnlyList<InputProblem>? problems = null) =>
        Envelope(new JsonObject(), exitCode, error, problems);

    /// <summary>Adds the fields every document has, in front of the command's own.</summary>
    public static JsonObject Envelope(JsonObject fields, int exitCode, string? error, IReadOnlyList<InputProblem>? problems)
    {
        var list = new JsonArray();
        foreach (var p in problems ?? [])
        {
            list.Add(Problem(p));
        }

        var document = new JsonObject { ["exitCode"] = exitCode, ["error"] = error, ["problems"] = list };
        foreach (var (key, value) in fields.ToList())
        {
            fields.Remove(key);
            document[key] = value;
        }

        return document;
    }

    /// <summary>summary.json's document with the envelope and the run folder (null when nothing was written).</summary>
    public static JsonObject Summary(SummaryDocument summary, int exitCode, string? folder)
    {
        var fields = JsonSerializer.SerializeToNode(summary, SummaryJsonWriter.Options)!.AsObject();
        fields["folder"] = folder;
        return Envelope(fields, exitCode, null, null);
    }

    public static void Write(TextWriter writer, JsonObject document) => writer.WriteLine(document.ToJsonString(SummaryJsonWriter.Options));

    private static JsonObject Problem(InputProblem p) => new()
    {
        ["file"] = p.File,
        ["sheet"] = p.Sheet,
        ["row"] = p.Row,
        ["column"] = p.Column,
        ["cell"] = p.Cell,
        ["jsonPath"] = p.JsonPath,
        ["position"] = p.Position,
        ["value"] = p.Value,
        ["problem"] = p.Problem,
        ["fix"] = p.Fix,
        ["message"] = p.ToString(),
    };
}
