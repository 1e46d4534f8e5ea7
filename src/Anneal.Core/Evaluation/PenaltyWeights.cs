namespace Anneal.Core.Evaluation;

/// <summary>Search-time prices for breaking hard rules; the search adapts them, the reported objective never includes them.</summary>
public struct PenaltyWeights
{
    public double TimeWindow;
    public double Capacity;
    public double Overtime;
    public double Duration;
    public double Equipment;
    public double Unserved;

    public static PenaltyWeights Uniform(double w) => new()
    {
        TimeWindow = w, Capacity = w, Overtime = w, Duration = w, Equipment = w * 10, Unserved = w * 100,
    };
}
