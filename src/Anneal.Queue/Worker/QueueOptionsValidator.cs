using Microsoft.Extensions.Options;

namespace Anneal.Queue.Worker;

/// <summary>Refuses queue settings that could only fail later: a heartbeat too slow to keep its lease, numbers out of range.</summary>
public sealed class QueueOptionsValidator : IValidateOptions<QueueOptions>
{
    public ValidateOptionsResult Validate(string? name, QueueOptions o)
    {
        var problems = new List<string>();
        if (string.IsNullOrWhiteSpace(o.ConnectionString))
        {
            problems.Add("no queue database: give --db CONN, ANNEAL_DB or Queue:ConnectionString");
        }

        Positive(problems, o.LeaseSeconds, "LeaseSeconds");
        Positive(problems, o.HeartbeatSeconds, "HeartbeatSeconds");
        Positive(problems, o.RetryMaxSeconds, "RetryMaxSeconds");
        if (o.HeartbeatSeconds > 0 && o.LeaseSeconds > 0 && o.HeartbeatSeconds * 2 > o.LeaseSeconds)
        {
            problems.Add($"Queue:HeartbeatSeconds ({o.HeartbeatSeconds}) must be at most half of Queue:LeaseSeconds ({o.LeaseSeconds}), so that one late heartbeat does not lose the lease");
        }

        return problems.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(problems);
    }

    private static void Positive(List<string> problems, double value, string key)
    {
        if (!(value > 0 && double.IsFinite(value)))
        {
            problems.Add($"Queue:{key} must be a positive number of seconds, not {value}");
        }
    }
}
