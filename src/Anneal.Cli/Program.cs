using Anneal.Cli;

return CliApp.Run(args, new CliContext(Console.Out, Console.Error)
{
    ProgressIsTerminal = !Console.IsErrorRedirected,
    HandleSignals = true,
    SinceStart = () => DateTime.Now - System.Diagnostics.Process.GetCurrentProcess().StartTime,
});
