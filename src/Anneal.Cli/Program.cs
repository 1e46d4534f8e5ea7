using Anneal.Cli;

return CliApp.Run(args, new CliContext(Console.Out, Console.Error)
{
    ProgressIsTerminal = !Console.IsErrorRedirected,
    HandleSignals = true,
});
