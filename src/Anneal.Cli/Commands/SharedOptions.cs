using System.CommandLine;
using Anneal.Core.Model;
using Anneal.Formats.Input;

namespace Anneal.Cli.Commands;

/// <summary>Arguments and options several commands take, defined once so their names and help agree.</summary>
public static class SharedOptions
{
    public static Argument<string> Input() => new("input")
    {
        Description = "A CSV job folder, an .xlsx workbook, a Solomon or Li & Lim .txt file or a CVRPLIB .vrp file.",
    };

    public static Option<string?> Objective() => OptionValues.Choice("--objective",
        $"What to minimise: {ObjectiveNames.Accepted}. Default: the job's settings, else the format's convention.", "kind",
        "cost", "distance", "vehicles-then-distance");

    public static Option<string?> Out(string description) => new("--out")
    {
        Description = description,
        HelpName = "dir",
    };

    /// <summary>The instance under the objective chosen on the command line, else the job's, else the reader's.</summary>
    public static Instance WithObjective(LoadedInput input, string? objectiveText)
    {
        var objective = input.Settings.Objective ?? input.Instance.Objective;
        if (objectiveText is not null && ObjectiveNames.TryParse(objectiveText, out var chosen))
        {
            objective = chosen;
        }

        return objective == input.Instance.Objective ? input.Instance : input.Instance.With(objective: objective);
    }
}
