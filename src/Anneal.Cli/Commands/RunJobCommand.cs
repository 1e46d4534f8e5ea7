using System.CommandLine;
using System.Globalization;
using Anneal.Cli.Reporting;
using Anneal.Core.Model;
using Anneal.Jobs;
using Anneal.Queue.Worker;
using Anneal.Worker.Isolation;
using Microsoft.Extensions.DependencyInjection;

namespace Anneal.Cli.Commands;

/// <summary>
/// `anneal run-job` (hidden): the solver process of one worker job (see <see cref="ChildSide"/>). Not for people:
/// the worker starts it, reads its standard output and tells a crash from a result by its exit.
/// </summary>
public static class RunJobCommand
{
    public static Command Create(CliContext context)
    {
        var input = new Argument<string>("input") { Description = "The job as located by the worker." };
        var output = new Option<string>("--out") { Description = "Folder to write the run's files into.", Required = true };
        var solvers = new Option<string?>("--solvers") { Description = "Solver names, as the worker was asked." };
        var time = new Option<string>("--default-time") { Description = "Budget for a job whose settings give none.", DefaultValueFactory = _ => "60" };
        var threads = new Option<int>("--threads") { Description = "Independent searches per solver.", DefaultValueFactory = _ => 1 };
        var claimed = new Option<string?>("--claimed-at") { Description = "When the job's budget began (ISO 8601), so the whole run keeps within it." };
        var budget = new Option<string?>("--time") { Description = "Budget asked for the job (else its settings, else --default-time)." };
        var iterations = new Option<long?>("--iterations") { Description = "Iteration budget asked for the job." };
        var target = new Option<string?>("--target") { Description = "Objective to stop at." };
        var objective = new Option<string?>("--objective") { Description = "Objective asked for the job." };
        var seed = new Option<int?>("--seed") { Description = "Seed asked for the job." };
        var searchBudget = new Option<bool>(ChildSide.SearchBudget) { Description = "The budget is the solvers' own, not the whole run's." };
        var package = new Option<string?>("--package") { Description = "Also save the database worker's result package (without the files) to this file." };
        var benchBudget = new Option<string?>("--bench-budget") { Description = "The budget recorded with a benchmark run's package." };
        var command = new Command(ChildSide.Command, "Solve one worker job in its own process (used by `anneal worker`).") { Hidden = true };
        command.Arguments.Add(input);
        foreach (Option option in new Option[] { output, solvers, time, threads, claimed, budget, iterations, target, objective, seed, searchBudget, package, benchBudget })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse =>
        {
            bool wholeRun = !parse.GetValue(searchBudget);
            var request = new JobRequest
            {
                Solvers = parse.GetValue(solvers),
                DefaultTimeSeconds = Number(parse.GetValue(time))!.Value,
                TimeSeconds = Number(parse.GetValue(budget)),
                Iterations = parse.GetValue(iterations),
                Target = Number(parse.GetValue(target)),
                Objective = ObjectiveNames.TryParse(parse.GetValue(objective), out var kind) ? kind : null,
                Seed = parse.GetValue(seed),
                Threads = parse.GetValue(threads),
                WholeRun = wholeRun,
                Spent = wholeRun ? Spent(parse.GetValue(claimed)) : TimeSpan.Zero,
            };
            string folder = parse.GetValue(output)!;
            Action<JobRun>? written = parse.GetValue(package) is { } file
                ? run => ResultPackage.From(run, folder, Number(parse.GetValue(benchBudget))).Save(file)
                : null;
            using var stop = CancellationTokenSource.CreateLinkedTokenSource(context.Cancel);
            using var signals = context.HandleSignals ? ChildSide.StopOnSigterm(stop) : null;
            ChildSide.StopWhenParentEnds(Console.OpenStandardInput(), stop);
            var services = CliServices.Shared;
            return ChildSide.Run(services.GetRequiredService<JobRunner>(), services.GetRequiredService<RunWriter>(), parse.GetValue(input)!, folder,
                request, context.Out, TimeProvider.System, stop.Token, written);
        });
        return command;
    }

    private static double? Number(string? text) => text is null ? null : double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture);

    private static TimeSpan Spent(string? claimedAt)
    {
        if (claimedAt is null || !DateTimeOffset.TryParse(claimedAt, CultureInfo.InvariantCulture, DateTimeStyles.RoundtripKind, out var at))
        {
            return TimeSpan.Zero;
        }

        var spent = TimeProvider.System.GetUtcNow() - at;
        return spent > TimeSpan.Zero ? spent : TimeSpan.Zero;
    }
}
