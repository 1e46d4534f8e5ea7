using System.CommandLine;
using Anneal.Cli.Reporting;
using Anneal.Jobs;
using Anneal.Core.Evaluation;
using Anneal.Core.Plans;
using Anneal.Formats.Input;
using Anneal.Formats.Output;
using Anneal.Formats.Output.Artifacts;
using Microsoft.Extensions.DependencyInjection;

namespace Anneal.Cli.Commands;

/// <summary>`anneal evaluate`: the cost and verdict of a plan someone already has (e.g. today's manual routes).</summary>
public static class EvaluateCommand
{
    public static Command Create(CliContext context)
    {
        var input = SharedOptions.Input();
        var routes = new Option<string>("--routes")
        {
            Description = "The plan to judge: a route file naming, per vehicle, its stops in order.",
            HelpName = "file",
            Required = true,
        };
        var objective = SharedOptions.Objective();
        var output = SharedOptions.Out("Also write routes.csv and summary.json into this folder.");
        var json = JsonOutput.Option();
        var command = new Command("evaluate", "Cost, breakdown and verdict of a given plan; exit 0 feasible, 3 infeasible, 2 bad input.");
        command.Arguments.Add(input);
        command.Options.Add(routes);
        command.Options.Add(objective);
        command.Options.Add(output);
        command.Options.Add(json);
        command.SetAction(parse =>
        {
            var loaded = InputLoader.Load(parse.GetValue(input)!);
            var instance = SharedOptions.WithObjective(loaded, parse.GetValue(objective));
            var plan = RouteFileReader.Read(parse.GetValue(routes)!, instance);
            return Execute(loaded with { Instance = instance }, plan, parse.GetValue(routes)!, parse.GetValue(output), JsonOutput.For(context, parse.GetValue(json)));
        });
        return command;
    }

    /// <param name="input">The input, its instance already under the chosen objective.</param>
    public static int Execute(LoadedInput input, Plan plan, string routesPath, string? outDir, CliContext context)
    {
        var instance = input.Instance;
        var structure = plan.StructureErrors(instance);
        if (structure.Count > 0)
        {
            var problems = new List<InputProblem>();
            foreach (var error in structure)
            {
                problems.Add(new InputProblem(routesPath, null, null, null, error, "give each stop and each vehicle at most once"));
            }

            throw new InputException(problems);
        }

        var evaluation = PlanEvaluator.Evaluate(instance, plan);
        context.Out.WriteLine($"Evaluating {routesPath} on {InstanceDescription.Size(instance)}");
        PlanReport.Print(context.Out, instance, evaluation);
        var facts = new RunFacts(null, null, false, context.Now().ToUniversalTime());
        string? folder = null;
        SummaryDocument summary;
        if (outDir is not null)
        {
            folder = OutputFolder.Create(outDir);
            summary = context.Services.GetRequiredService<RunWriter>().Write(folder, input, instance, evaluation, null, facts);
            context.Out.WriteLine($"Written: {folder}");
        }
        else
        {
            summary = RunSummary.For(input, instance, evaluation, null, facts);
        }

        int code = evaluation.Feasible ? ExitCodes.Success : ExitCodes.Infeasible;
        if (context.Json is not null)
        {
            JsonOutput.Write(context.Json, JsonOutput.Summary(summary, code, folder));
        }

        return code;
    }
}
