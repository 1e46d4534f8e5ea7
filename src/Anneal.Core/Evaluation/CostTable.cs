using Anneal.Core.Model;

namespace Anneal.Core.Evaluation;

/// <summary>
/// The objective and rules of an instance flattened into per-vehicle coefficients and per-rule prices, so that
/// costing a route is a handful of multiplications with no branching on the objective kind or rule choice.
/// </summary>
public sealed class CostTable
{
    internal readonly double[] Base;
    internal readonly double[] PerDistance;
    internal readonly double[] PerTime;
    private readonly double[] _shiftEnd;
    private readonly double[] _maxDuration;
    private readonly ulong[] _equipment;

    // Soft prices (zero when the rule is hard) and hard selectors (one when the rule is hard).
    internal readonly double SoftTimeWindow, SoftCapacity, SoftOvertime, SoftDuration;
    internal readonly double HardTimeWindow, HardCapacity, HardOvertime, HardDuration;

    public CostTable(Instance instance)
    {
        int count = instance.Vehicles.Count;
        Base = new double[count];
        PerDistance = new double[count];
        PerTime = new double[count];
        _shiftEnd = new double[count];
        _maxDuration = new double[count];
        _equipment = new ulong[count];
        for (int k = 0; k < count; k++)
        {
            var v = instance.Vehicles[k];
            switch (instance.Objective)
            {
                case Objective.Cost:
                    Base[k] = v.FixedCost;
                    PerDistance[k] = v.CostPerDistance;
                    PerTime[k] = v.CostPerHour / instance.TimeUnitsPerHour;
                    break;
                case Objective.Distance:
                    PerDistance[k] = 1;
                    break;
                default:
                    Base[k] = instance.VehicleWeight;
                    PerDistance[k] = 1;
                    break;
            }

            _shiftEnd[k] = v.ShiftEnd;
            _maxDuration[k] = v.MaxDuration;
            _equipment[k] = v.Equipment;
        }

        var rules = instance.Rules;
        (SoftTimeWindow, HardTimeWindow) = Split(rules.TimeWindows);
        (SoftCapacity, HardCapacity) = Split(rules.Capacity);
        (SoftOvertime, HardOvertime) = Split(rules.ShiftEnd);
        (SoftDuration, HardDuration) = Split(rules.MaxDuration);
    }

    public double ShiftEnd(int vehicle) => _shiftEnd[vehicle];

    public double MaxDuration(int vehicle) => _maxDuration[vehicle];

    public ulong Equipment(int vehicle) => _equipment[vehicle];

    private static (double Soft, double Hard) Split(Rule rule) => rule.Hard ? (0, 1) : (rule.Price, 0);
}
