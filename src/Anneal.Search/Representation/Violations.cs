namespace Anneal.Search.Representation;

/// <summary>How much the current plan breaks each hard rule.</summary>
public struct Violations
{
    public double TimeWindow;
    public double Capacity;
    public double Overtime;
    public double Duration;
    public double Skill;
    public double Unserved;
}
