using System.CommandLine;
using System.Globalization;
using Anneal.Cli.Reporting;
using Anneal.Jobs;
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
        var command = new Command(ChildSide.Command, "Solve one worker job in its own process (used by `anneal worker`).") { Hidden = true };
        command.Arguments.Add(input);
        foreach (Option option in new Option[] { output, solvers, time, threads, claimed })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse =>
        {
            var request = new JobRequest
            {
                Solvers = parse.GetValue(solvers),
                DefaultTimeSeconds = double.Parse(parse.GetValue(time)!, NumberStyles.Float, CultureInfo.InvariantCulture),
                Threads = parse.GetValue(threads),
                WholeRun = true,
                Spent = Spent(parse.GetValue(claimed)),
            };
            using var stop = CancellationTokenSource.CreateLinkedTokenSource(context.Cancel);
            using var signals = context.HandleSignals ? ChildSide.StopOnSigterm(stop) : null;
            ChildSide.StopWhenParentEnds(Console.OpenStandardInput(), stop);
            var services = CliServices.Shared;
            return ChildSide.Run(services.GetRequiredService<JobRunner>(), services.GetRequiredService<RunWriter>(), parse.GetValue(input)!, parse.GetValue(output)!,
                request, context.Out, TimeProvider.System, stop.Token);
        });
        return command;
    }

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
