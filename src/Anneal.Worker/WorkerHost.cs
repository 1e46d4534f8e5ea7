using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Console;
using Microsoft.Extensions.Options;

namespace Anneal.Worker;

/// <summary>
/// Wires the worker's host: settings from appsettings.json next to the executable, then appsettings.json in the
/// current folder, then ANNEAL_* environment variables, then the command line (each overriding the one before);
/// logs on stderr (journald's format under systemd); the worker service.
/// </summary>
public static class WorkerHost
{
    public const string SettingsFile = "appsettings.json";
    public const string EnvironmentPrefix = "ANNEAL_";

    /// <summary>The settings files and variables every Anneal host reads, in order (later ones win); the command line goes last.</summary>
    public static IConfigurationBuilder AddSettingsSources(IConfigurationBuilder configuration) =>
        configuration
            .AddJsonFile(Path.Combine(AppContext.BaseDirectory, SettingsFile), optional: true, reloadOnChange: false)
            .AddJsonFile(Path.Combine(Environment.CurrentDirectory, SettingsFile), optional: true, reloadOnChange: false)
            .AddEnvironmentVariables(EnvironmentPrefix);

    /// <param name="commandLine">Settings given on the command line, as configuration keys (e.g. "Worker:Inbox").</param>
    /// <param name="addAnneal">Registers the solvers and run writers, as the host wants them (<c>s => s.AddAnneal().AddOrTools()</c>).</param>
    /// <param name="backEnd">Registers the loop that serves jobs from elsewhere (the database worker); null: the folder worker.</param>
    public static IHost Build(IReadOnlyDictionary<string, string?> commandLine, WorkerRun run, Action<IServiceCollection> addAnneal, Action<IServiceCollection, IConfiguration>? backEnd = null)
    {
        var builder = Host.CreateEmptyApplicationBuilder(new HostApplicationBuilderSettings { ContentRootPath = Environment.CurrentDirectory });
        AddSettingsSources(builder.Configuration).AddInMemoryCollection(commandLine);

        builder.Logging.SetMinimumLevel(LogLevel.Information);
        builder.Logging.AddFilter("Microsoft", LogLevel.Warning);
        builder.Logging.AddConfiguration(builder.Configuration.GetSection("Logging"));
        AddConsoleLog(builder.Logging, builder.Services);

        // stdout stays free for whatever calls the worker; every log line goes to stderr.
        builder.Services.Configure<ConsoleLoggerOptions>(o => o.LogToStandardErrorThreshold = LogLevel.Trace);

        var services = builder.Services;
        addAnneal(services);
        services.AddSingleton(run);
        services.TryAddSingleton(Isolation.SolverProcess.Current());
        services.AddSingleton(TimeProvider.System);
        services.AddSingleton<IValidateOptions<WorkerOptions>, WorkerOptionsValidator>();
        services.AddSingleton(new WorkerSettingsText(builder.Configuration));
        services.AddOptions<WorkerOptions>().Configure<WorkerSettingsText>((options, text) => text.Apply(options)).ValidateOnStart();
        services.AddOptions<HostOptions>().Configure<IOptions<WorkerOptions>>((host, worker) =>
            host.ShutdownTimeout = TimeSpan.FromSeconds(worker.Value.ShutdownTimeoutSeconds));
        services.Configure<ConsoleLifetimeOptions>(o => o.SuppressStatusMessages = true);

        // The IServiceCollection form of UseSystemd(): notify systemd when ready and stopping; a no-op outside systemd.
        services.AddSystemd();
        if (backEnd is null)
        {
            services.AddHostedService<WorkerService>();
        }
        else
        {
            backEnd(services, builder.Configuration);
        }

        return builder.Build();
    }

    /// <summary>
    /// Console logs: one plain line per event, or JSON lines for log collectors when Logging:Console:FormatterName is
    /// "json" (ANNEAL_Logging__Console__FormatterName=json); the configuration's choice wins over the plain default.
    /// </summary>
    public static void AddConsoleLog(ILoggingBuilder logging, IServiceCollection services)
    {
        logging.AddConsole(o => o.FormatterName ??= ConsoleFormatterNames.Simple);
        services.Configure<SimpleConsoleFormatterOptions>(o =>
        {
            o.SingleLine = true;
            o.TimestampFormat = "yyyy-MM-dd HH:mm:ss ";
        });
        services.Configure<JsonConsoleFormatterOptions>(o =>
        {
            o.TimestampFormat = "yyyy-MM-ddTHH:mm:ss.fffzzz";
            o.UseUtcTimestamp = false;
        });
    }
}
