namespace Anneal.Worker;

/// <summary>What happens to a job whose search is cut short because the worker is stopping.</summary>
public enum ShutdownChoice
{
    /// <summary>Publish the interrupted plan and put the job back in the inbox; a later run replaces the plan with a full one.</summary>
    Requeue,

    /// <summary>Publish the interrupted plan as the job's result; the job is done.</summary>
    Complete,
}
