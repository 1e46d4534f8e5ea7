using Anneal.Queue.Worker;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Options;

namespace Microsoft.Extensions.DependencyInjection;

/// <summary>Registers the database worker in place of the folder worker: its options (section "Queue"), validated at start-up, and its loop.</summary>
public static class QueueWorkerServices
{
    public static IServiceCollection AddQueueWorker(this IServiceCollection services, IConfiguration configuration)
    {
        services.AddSingleton<IValidateOptions<QueueOptions>, QueueOptionsValidator>();
        services.AddOptions<QueueOptions>().Bind(configuration.GetSection(QueueOptions.Section)).ValidateOnStart();
        services.AddHostedService<QueueWorkerService>();
        return services;
    }
}
