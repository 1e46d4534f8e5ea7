using System.CommandLine;
using System.CommandLine.Invocation;
using Anneal.Cli.Commands;
using Anneal.Cli.Reporting;
using Anneal.Core.Solving;
using Anneal.Formats.Input;
using Anneal.Formats.Output;

namespace Anneal.Cli;

/// <summary>The `anneal` command, callable in-process: parses the arguments, runs the command, maps failures to exit codes.</summary>
public static class CliApp
{
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr) => Run(args, new CliContext(stdout, stderr));

    public static int Run(string[] args, CliContext context)
    {
        ParseResult? parsed = null;
        try
        {
            var root = BuildRoot(context);
            parsed = root.Parse(args);
            var mistakes = UsageErrors.Describe(parsed);
            if (mistakes.Count > 0)
            {
                foreach (var line in mistakes)
                {
                    context.Err.WriteLine("anneal: " + line);
                }

                if (JsonOutput.Requested(parsed, args))
                {
                    JsonOutput.Write(context.Out, JsonOutput.Error(ExitCodes.InvalidInput, "the command line is not valid: " + string.Join("; ", mistakes)));
                }

                var command = parsed.CommandResult.Command;
                context.Err.WriteLine(command is RootCommand ? "Try 'anneal --help' or 'anneal <command> --help'." : $"Try '{UsageErrors.Name(command)} --help'.");
                return ExitCodes.InvalidInput;
            }

            return parsed.Invoke(new InvocationConfiguration
            {
                Output = context.Out,
                Error = context.Err,
                EnableDefaultExceptionHandler = false,

                // Signals are handled by `solve` itself so that it can still write the best plan.
                ProcessTerminationTimeout = null,
            });
        }
        catch (InputException e)
        {
            ProblemPrinter.Print(context.Err, e.Problems);
            return Failed(ExitCodes.InvalidInput, "the input is not valid", e.Problems);
        }
        catch (UnknownSolverException e)
        {
            context.Err.WriteLine("anneal: " + e.Message);
            return Failed(ExitCodes.InvalidInput, e.Message);
        }
        catch (OutputException e)
        {
            context.Err.WriteLine("anneal: " + e.Message);
            return Failed(ExitCodes.OutputFailed, e.Message);
        }
        catch (Exception e)
        {
            context.Err.WriteLine("anneal: internal error: " + e.Message);
            if (Environment.GetEnvironmentVariable("ANNEAL_DEBUG") == "1")
            {
                context.Err.WriteLine(e.ToString());
            }

            return Failed(ExitCodes.InternalError, "internal error: " + e.Message);
        }

        // With --json a failure is a document too, so a script always has one to read.
        int Failed(int code, string error, IReadOnlyList<InputProblem>? problems = null)
        {
            if (JsonOutput.Requested(parsed, args))
            {
                JsonOutput.Write(context.Out, JsonOutput.Error(code, error, problems));
            }

            return code;
        }
    }

    public static RootCommand BuildRoot(CliContext context)
    {
        var root = new RootCommand("Anneal plans delivery routes under hard and soft rules (vehicle routing with capacities and time windows).");
        foreach (var option in root.Options)
        {
            if (option is VersionOption version)
            {
                version.Action = new PrintVersion(context);
            }
        }

        root.Subcommands.Add(CheckCommand.Create(context));
        root.Subcommands.Add(EvaluateCommand.Create(context));
        root.Subcommands.Add(SolveCommand.Create(context));
        root.Subcommands.Add(BenchCommand.Create(context));
        root.Subcommands.Add(PlotCommand.Create(context));
        root.Subcommands.Add(WorkerCommand.Create(context));
        root.Subcommands.Add(RunJobCommand.Create(context));
        root.Subcommands.Add(Commands.Queue.QueueCommand.Create(context));
        return root;
    }

    /// <summary>`anneal --version`: the version and the commit it was built from, e.g. "0.1.0 (commit f43935c26a4…)".</summary>
    private sealed class PrintVersion(CliContext context) : SynchronousCommandLineAction
    {
        public override int Invoke(ParseResult parseResult)
        {
            context.Out.WriteLine(ToolVersion.Text);
            return ExitCodes.Success;
        }
    }
}
