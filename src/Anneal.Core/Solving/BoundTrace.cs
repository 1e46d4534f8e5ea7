namespace Anneal.Core.Solving;

/// <summary>
/// A solver that proves lower bounds traces the bound as it rises: each point's best and current objective are the
/// bound so far, and its state starts with <see cref="Prefix"/>, so that progress lines and pictures tell it from a plan.
/// </summary>
public static class BoundTrace
{
    public const string Prefix = "lower bound";

    public static bool Is(TracePoint point) => point.State.StartsWith(Prefix, StringComparison.Ordinal);
}
