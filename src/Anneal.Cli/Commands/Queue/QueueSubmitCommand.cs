using System.CommandLine;
using System.Globalization;
using Anneal.Cli.Reporting;
using Anneal.Core.Model;
using Anneal.Formats.Input;
using Anneal.Jobs;
using Anneal.Queue.Jobs;
using Microsoft.Extensions.DependencyInjection;

namespace Anneal.Cli.Commands.Queue;

/// <summary>`anneal queue submit`: stores each job's input in the queue and prints one job id per line; refuses all of them if any is broken.</summary>
public static class QueueSubmitCommand
{
    public static Command Create(CliContext context)
    {
        var db = QueueAccess.DbOption();
        var jobs = new Argument<string[]>("jobs") { Description = "CSV job folders, .zip files of one, or Solomon / CVRPLIB files.", Arity = ArgumentArity.OneOrMore };
        var time = new Option<double?>("--time") { Description = "Search budget in seconds. Default: the job's timeSeconds, else the worker's --time.", HelpName = "seconds" };
        var solvers = new Option<string?>("--solvers") { Description = "Comma-separated solver names. Default: the worker's --solvers, else the job's list, else all that apply.", HelpName = "list" };
        var objective = SharedOptions.Objective();
        var priority = new Option<int>("--priority") { Description = "Higher runs first; equal priorities run in submission order. Default 0.", HelpName = "n" };
        var iterations = new Option<long?>("--iterations") { Description = "Also stop each solver after this many iterations.", HelpName = "n" };
        var seed = new Option<int?>("--seed") { Description = "Random seed. Default: the job's seed, else 1.", HelpName = "n" };
        var command = new Command("submit", "Store jobs in the queue (their input files, so they no longer depend on this disk) and print one job id per line; exit 2 and store none if any job is invalid.");
        command.Arguments.Add(jobs);
        foreach (Option option in new Option[] { db, time, solvers, objective, priority, iterations, seed })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse =>
        {
            var spec = new JobSpec
            {
                Solvers = parse.GetValue(solvers),
                TimeSeconds = parse.GetValue(time),
                Iterations = parse.GetValue(iterations),
                Objective = ObjectiveNames.TryParse(parse.GetValue(objective), out var o) ? o : null,
                Seed = parse.GetValue(seed),
                Priority = parse.GetValue(priority),
            };
            return Execute(parse.GetValue(db), parse.GetValue(jobs)!, spec, context);
        });
        return command;
    }

    public static int Execute(string? db, IReadOnlyList<string> paths, JobSpec spec, CliContext context)
    {
        if (spec.TimeSeconds is { } t && !(t > 0 && double.IsFinite(t)))
        {
            context.Err.WriteLine("anneal: --time must be a positive number of seconds");
            return ExitCodes.InvalidInput;
        }

        if (spec.Iterations is <= 0)
        {
            context.Err.WriteLine("anneal: --iterations must be at least 1");
            return ExitCodes.InvalidInput;
        }

        return QueueAccess.Run(context, db, checkSchema: true, async (source, cancel) =>
        {
            var submitter = new Submitter(source, context.Services.GetRequiredService<JobRunner>());

            // Every job is read before any is stored: a broken one refuses the lot, so fixing it and submitting again makes no duplicates.
            var packed = new List<Submitter.Packed>();
            var problems = new List<InputProblem>();
            foreach (var path in paths)
            {
                try
                {
                    packed.Add(submitter.Pack(path, spec));
                }
                catch (InputException e)
                {
                    problems.AddRange(e.Problems);
                }
            }

            if (problems.Count > 0)
            {
                ProblemPrinter.Print(context.Err, problems);
                context.Err.WriteLine("Nothing was submitted; fix the input and submit again.");
                return ExitCodes.InvalidInput;
            }

            var ids = await submitter.InsertAsync(packed, cancel);
            foreach (long id in ids)
            {
                context.Out.WriteLine(id.ToString(CultureInfo.InvariantCulture));
            }

            return ExitCodes.Success;
        });
    }
}
