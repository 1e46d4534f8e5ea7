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

    /// <summary>Per vehicle: the price per minute over its driving rules when they are soft, else zero.</summary>
    internal readonly double[] DrivingPrice;
    private readonly bool[] _driving;

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
        DrivingPrice = new double[count];
        _driving = new bool[count];
        for (int k = 0; k < count; k++)
        {
            var v = instance.Vehicles[k];
            (Base[k], PerDistance[k], PerTime[k]) = RatesOf(instance, v);
            VehiclesCost |= Base[k] > 0;

            _shiftEnd[k] = v.ShiftEnd;
            _maxDuration[k] = v.MaxDuration;
            _equipment[k] = v.Equipment;
            _driving[k] = v.DrivingRules is not null;
            DrivingRules |= _driving[k];
            DrivingPrice[k] = v.DrivingRules is { Rule.Hard: false } soft ? soft.Rule.Price : 0;
        }

        var rules = instance.Rules;
        var prices = rules.Stability;
        foreach (var s in instance.Stops)
        {
            PricesStability |= (s.PlannedVehicle >= 0 && prices.PerMove > 0) || (!double.IsNaN(s.PlannedStart) && prices.PerMinute > 0);
        }

        (SoftTimeWindow, HardTimeWindow) = Split(rules.TimeWindows);
        (SoftCapacity, HardCapacity) = Split(rules.Capacity);
        (SoftOvertime, HardOvertime) = Split(rules.ShiftEnd);
        (SoftDuration, HardDuration) = Split(rules.MaxDuration);
    }

    /// <summary>True when using a vehicle costs something (fixed costs, or vehicles-then-distance): fewer routes pay.</summary>
    public bool VehiclesCost { get; }

    /// <summary>What vehicle <paramref name="vehicle"/> costs under the objective.</summary>
    public VehicleRates Rates(int vehicle) => new(Base[vehicle], PerDistance[vehicle], PerTime[vehicle]);

    /// <summary>
    /// The objective's price of a vehicle, the one place it is decided: under cost its fixed cost, cost per distance
    /// and per time unit; under distance only the distance; under vehicles-then-distance the vehicle count's weight
    /// (<see cref="Instance.VehicleWeight"/>) and the distance.
    /// </summary>
    public static VehicleRates RatesOf(Instance instance, Vehicle v) => instance.Objective switch
    {
        Objective.Cost => new(v.FixedCost, v.CostPerDistance, v.CostPerHour / instance.Units.TimePerHour),
        Objective.Distance => new(0, 1, 0),
        _ => new(instance.VehicleWeight, 1, 0),
    };

    /// <summary>
    /// True in a re-plan whose stops carry a planned vehicle or start with a price on it: every route's measures then
    /// include its stability price (<see cref="RouteMetrics.Stability"/>), which needs each stop's start, so the search
    /// measures routes by the scheduler.
    /// </summary>
    public bool PricesStability { get; }

    /// <summary>True when some vehicle works under driving rules.</summary>
    public bool DrivingRules { get; }

    /// <summary>True when the vehicle works under driving rules: its routes are measured by the scheduler, breaks and all.</summary>
    public bool HasDrivingRules(int vehicle) => _driving[vehicle];

    public double ShiftEnd(int vehicle) => _shiftEnd[vehicle];

    public double MaxDuration(int vehicle) => _maxDuration[vehicle];

    public ulong Equipment(int vehicle) => _equipment[vehicle];

    private static (double Soft, double Hard) Split(Rule rule) => rule.Hard ? (0, 1) : (rule.Price, 0);
}

/// <summary>A vehicle's price under the objective: for being used, per distance unit, per time unit of route duration.</summary>
public readonly record struct VehicleRates(double Fixed, double PerDistance, double PerTime);
