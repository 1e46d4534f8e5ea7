using Anneal.Core.Solving;
using Microsoft.Extensions.Options;

namespace Anneal.Worker;

/// <summary>Refuses settings that would only fail later, at start-up, with every problem named at once.</summary>
public sealed class WorkerOptionsValidator(SolverCatalog catalog, WorkerRun run, WorkerSettingsText? text = null) : IValidateOptions<WorkerOptions>
{
    public ValidateOptionsResult Validate(string? name, WorkerOptions options)
    {
        // Values of the wrong kind first (they kept their defaults below), then the ranges and folders.
        var problems = new List<string>(text?.Problems ?? []);
        if (run.UsesFolders)
        {
            Folder(problems, options.Inbox, "Inbox", "--inbox DIR", required: true);
            Folder(problems, options.Outbox, "Outbox", "--outbox DIR", required: true);
            Folder(problems, options.Working, "Working", null, required: false);
            Folder(problems, options.Failed, "Failed", null, required: false);
            if (problems.Count == 0)
            {
                Distinct(problems, WorkerFolders.From(options));
                if (!options.CreateFolders && !Directory.Exists(options.Inbox))
                {
                    problems.Add($"the inbox {Path.GetFullPath(options.Inbox!)} does not exist: check the path, or give --create-folders "
                        + "(Worker:CreateFolders) to create it with the folders beside it");
                }
            }
        }

        AtLeast(problems, options.ConcurrentJobs, 1, "ConcurrentJobs (--jobs)");
        AtLeast(problems, options.ThreadsPerJob, 1, "ThreadsPerJob (--threads)");
        AtLeast(problems, options.MaxRetries, 0, "MaxRetries");
        Positive(problems, options.TimeSeconds, "TimeSeconds (--time)");
        Positive(problems, options.ShutdownTimeoutSeconds, "ShutdownTimeoutSeconds");
        Positive(problems, options.HangGraceSeconds, "HangGraceSeconds");
        Positive(problems, options.PollSeconds, "PollSeconds");
        Positive(problems, options.StatusSeconds, "StatusSeconds");
        Positive(problems, options.RecoverSeconds, "RecoverSeconds");
        if (!(options.SettleSeconds >= 0 && double.IsFinite(options.SettleSeconds)))
        {
            problems.Add($"Worker:SettleSeconds must be 0 or more seconds, not {options.SettleSeconds}");
        }

        if (options.MaxZipBytes < 1)
        {
            problems.Add($"Worker:MaxZipBytes must be at least 1 byte, not {options.MaxZipBytes}");
        }

        if (!(options.MaxZipRatio >= 1 && double.IsFinite(options.MaxZipRatio)))
        {
            problems.Add($"Worker:MaxZipRatio must be a number of at least 1, not {options.MaxZipRatio}");
        }

        foreach (var solver in SolverCatalog.Split(options.Solvers ?? string.Empty))
        {
            if (!catalog.Exists(solver))
            {
                problems.Add("Worker:Solvers: " + catalog.Unknown(solver).Message);
            }
        }

        return problems.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(problems);
    }

    private static void Folder(List<string> problems, string? path, string key, string? flag, bool required)
    {
        if (string.IsNullOrWhiteSpace(path))
        {
            if (required)
            {
                string how = flag is null ? string.Empty : $"{flag} or ";
                problems.Add($"the {key.ToLowerInvariant()} folder is not set: give {how}Worker:{key} in appsettings.json or ANNEAL_Worker__{key}");
            }

            return;
        }

        try
        {
            _ = Path.GetFullPath(path);
        }
        catch (Exception e) when (e is ArgumentException or NotSupportedException or PathTooLongException)
        {
            problems.Add($"Worker:{key} is not a usable path ('{path}'): {e.Message}");
        }
    }

    private static void Distinct(List<string> problems, WorkerFolders folders)
    {
        var seen = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var (key, path) in new[] { ("Inbox", folders.Inbox), ("Outbox", folders.Outbox), ("Working", folders.Working), ("Failed", folders.Failed) })
        {
            if (seen.TryGetValue(path, out var other))
            {
                problems.Add($"Worker:{key} and Worker:{other} are the same folder ({path}); give each its own");
            }
            else
            {
                seen[path] = key;
            }
        }
    }

    private static void AtLeast(List<string> problems, int value, int least, string key)
    {
        if (value < least)
        {
            problems.Add($"Worker:{key} must be at least {least}, not {value}");
        }
    }

    private static void Positive(List<string> problems, double value, string key)
    {
        if (!(value > 0 && double.IsFinite(value)))
        {
            problems.Add($"Worker:{key} must be a positive number of seconds, not {value}");
        }
    }
}
