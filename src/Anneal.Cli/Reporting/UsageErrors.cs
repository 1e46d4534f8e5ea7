using System.CommandLine;
using System.Text.RegularExpressions;
using Anneal.Cli.Commands;
using Anneal.Formats.Input;

namespace Anneal.Cli.Reporting;

/// <summary>
/// Command-line mistakes in the user's words, all at once: a mistyped option or command names the nearest one
/// ("unknown option '--tim'; did you mean --time?"), and no .NET type name ever reaches the user.
/// </summary>
public static partial class UsageErrors
{
    private const string Unrecognized = "Unrecognized command or argument";

    /// <summary>The mistakes in <paramref name="parsed"/>; empty when there are none.</summary>
    public static List<string> Describe(ParseResult parsed)
    {
        var command = parsed.CommandResult.Command;
        string name = Name(command);
        var lines = new List<string>();
        var unmatched = new List<string>(parsed.UnmatchedTokens);

        // An argument that takes many values (bench's inputs) swallows a mistyped option: "--seed 3" becomes two inputs.
        foreach (var argument in parsed.CommandResult.Children.OfType<System.CommandLine.Parsing.ArgumentResult>())
        {
            if (argument.Argument.Arity.MaximumNumberOfValues > 1)
            {
                foreach (var token in argument.Tokens)
                {
                    if (token.Value.StartsWith("--", StringComparison.Ordinal) && !File.Exists(token.Value) && !Directory.Exists(token.Value))
                    {
                        unmatched.Add(token.Value);
                    }
                }
            }
        }

        if (unmatched.Count == 0 && parsed.Errors.Count == 0)
        {
            return lines;
        }

        for (int i = 0; i < unmatched.Count; i++)
        {
            string token = unmatched[i];
            if (token.StartsWith('-'))
            {
                var options = OptionNames(command);
                var near = Closest.Find(token, options);
                lines.Add($"unknown option '{token}' for {name}" + (near is not null
                    ? $"; did you mean {near}?"
                    : $"; its options are {Words.OneOf(options.Where(o => o.StartsWith("--", StringComparison.Ordinal)).ToList())}"));
                if (i + 1 < unmatched.Count && !unmatched[i + 1].StartsWith('-'))
                {
                    i++; // the mistyped option's value
                }
            }
            else if (command.Subcommands.Count > 0)
            {
                var commands = command.Subcommands.Select(c => c.Name).ToList();
                var near = Closest.Find(token, commands);
                lines.Add($"unknown command '{token}'" + (near is not null ? $"; did you mean {near}?" : $"; the commands are {Words.OneOf(commands)}"));
                return lines; // what follows belongs to the command that was meant
            }
            else
            {
                lines.Add($"unexpected argument '{token}' for {name}");
            }
        }

        foreach (var error in parsed.Errors)
        {
            if (!error.Message.StartsWith(Unrecognized, StringComparison.Ordinal))
            {
                lines.Add(Plain(error.Message, error.SymbolResult));
            }
        }

        return lines;
    }

    /// <summary>"anneal solve", or "anneal" for the root.</summary>
    public static string Name(Command command) => command is RootCommand ? "anneal" : "anneal " + command.Name;

    private static List<string> OptionNames(Command command)
    {
        var names = new List<string>();
        for (var c = command; c is not null; c = c.Parents.OfType<Command>().FirstOrDefault())
        {
            foreach (var option in c.Options)
            {
                if (c == command || option.Recursive)
                {
                    names.Add(option.Name);
                    names.AddRange(option.Aliases);
                }
            }
        }

        return names.Distinct().ToList();
    }

    /// <summary>The parser's own wording, kept when it is plain, rephrased where it would name a .NET type.</summary>
    private static string Plain(string message, System.CommandLine.Parsing.SymbolResult? symbol)
    {
        var typed = CannotParse().Match(message);
        if (typed.Success)
        {
            return $"{typed.Groups["option"].Value} does not take '{typed.Groups["value"].Value}'; see its description in --help";
        }

        if (TypeName().IsMatch(message))
        {
            return symbol is System.CommandLine.Parsing.OptionResult o
                ? $"{o.Option.Name} has a value it does not take; see its description in --help"
                : "a value on the command line is not of the kind expected; see --help";
        }

        if (message.StartsWith("Required argument missing for command", StringComparison.Ordinal))
        {
            return "the input is missing: give a CSV job folder, an .xlsx workbook or a benchmark file (or, for plot, a run folder)";
        }

        return message.TrimEnd('.');
    }

    [GeneratedRegex(@"^Cannot parse argument '(?<value>.*)' for (option|command) '(?<option>[^']*)'")]
    private static partial Regex CannotParse();

    [GeneratedRegex(@"System\.[A-Z]|expected type")]
    private static partial Regex TypeName();
}
