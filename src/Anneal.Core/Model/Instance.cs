using Anneal.Core.Travel;

namespace Anneal.Core.Model;

/// <summary>
/// Everything a solver needs: stops, depots, fleet, rules, objective and travel. Location index i &lt; StopCount
/// is stop i; StopCount + d is depot d. Flat arrays beside the records serve the hot loops.
/// </summary>
public sealed class Instance
{
    public string Name { get; }
    public IReadOnlyList<Stop> Stops { get; }
    public IReadOnlyList<Depot> Depots { get; }
    public IReadOnlyList<Vehicle> Vehicles { get; }
    public IReadOnlyList<string> DimensionNames { get; }
    public IReadOnlyList<string> EquipmentNames { get; }
    public RuleSet Rules { get; }
    public Objective Objective { get; }
    public TravelTable Travel { get; }

    /// <summary>How times and distances are measured and read (minutes and km for CSV jobs, plain numbers for benchmark files).</summary>
    public Units Units { get; }

    public int StopCount { get; }
    public int DimensionCount { get; }

    /// <summary>Price of one vehicle under <see cref="Objective.VehiclesThenDistance"/>: larger than any plan's distance.</summary>
    public double VehicleWeight { get; }

    // Flat views for the evaluation kernels.
    internal readonly double[] DemandFlat;
    internal readonly double[] Service;
    internal readonly int[] WindowOffset;
    internal readonly double[] WindowOpen;
    internal readonly double[] WindowClose;
    internal readonly double[] CapacityFlat;
    internal readonly double[] PickupFlat;

    /// <summary>Per stop: the other stop of its pair (collection for a delivery, delivery for a collection), else -1.</summary>
    internal readonly int[] PartnerOf;

    /// <summary>True when some stop collects something (returns or pairs): the load then changes along a route.</summary>
    public bool HasPickups { get; }

    /// <summary>True when some stops form collect-and-deliver pairs.</summary>
    public bool HasPairs { get; }

    /// <summary>True when every stop has exactly one window (allows O(1) segment concatenation).</summary>
    public bool SingleWindows { get; }

    public Instance(
        string name,
        IReadOnlyList<Stop> stops,
        IReadOnlyList<Depot> depots,
        IReadOnlyList<Vehicle> vehicles,
        IReadOnlyList<string> dimensionNames,
        IReadOnlyList<string> equipmentNames,
        RuleSet rules,
        Objective objective,
        TravelTable travel,
        Units? units = null)
    {
        Name = name;
        Stops = stops;
        Depots = depots;
        Vehicles = vehicles;
        DimensionNames = dimensionNames;
        EquipmentNames = equipmentNames;
        Rules = rules;
        Objective = objective;
        Travel = travel;
        Units = units ?? Units.Plain;
        StopCount = stops.Count;
        DimensionCount = dimensionNames.Count;
        if (travel.Count != stops.Count + depots.Count)
        {
            throw new ArgumentException("The travel table must cover every stop and depot.", nameof(travel));
        }

        int dims = DimensionCount;
        DemandFlat = new double[StopCount * dims];
        PickupFlat = new double[StopCount * dims];
        PartnerOf = Pairs.Link(stops);
        bool pickups = false;
        Service = new double[StopCount];
        WindowOffset = new int[StopCount + 1];
        var open = new List<double>();
        var close = new List<double>();
        bool single = true;
        for (int i = 0; i < StopCount; i++)
        {
            var s = stops[i];
            for (int d = 0; d < dims; d++)
            {
                DemandFlat[(i * dims) + d] = s.Demand[d];
                double up = d < s.Pickup.Length ? s.Pickup[d] : 0;
                PickupFlat[(i * dims) + d] = up;
                pickups |= up != 0;
            }

            Service[i] = s.ServiceTime;
            WindowOffset[i] = open.Count;
            foreach (var w in s.Windows)
            {
                open.Add(w.Open);
                close.Add(w.Close);
            }

            single &= s.Windows.Length == 1;
        }

        WindowOffset[StopCount] = open.Count;
        WindowOpen = open.ToArray();
        WindowClose = close.ToArray();
        SingleWindows = single;
        HasPairs = Array.Exists(PartnerOf, p => p >= 0);
        HasPickups = pickups || HasPairs;
        CapacityFlat = new double[vehicles.Count * dims];
        for (int v = 0; v < vehicles.Count; v++)
        {
            for (int d = 0; d < dims; d++)
            {
                CapacityFlat[(v * dims) + d] = vehicles[v].Capacity[d];
            }
        }

        // A vehicle must outweigh any plan's distance: bound it by serving every stop on its own route.
        double bound = 1.0;
        int home = depots.Count > 0 ? StopCount : -1;
        for (int i = 0; home >= 0 && i < StopCount; i++)
        {
            bound += travel.Distance(home, i) + travel.Distance(i, home);
        }

        VehicleWeight = Math.Pow(10, Math.Ceiling(Math.Log10(bound)) + 1);
        Costs = new Evaluation.CostTable(this);
    }

    /// <summary>The objective and rules as flat coefficients (see <see cref="Evaluation.CostTable"/>).</summary>
    public Evaluation.CostTable Costs { get; }

    public int DepotLocation(int depot) => StopCount + depot;

    public double Demand(int stop, int dimension) => DemandFlat[(stop * DimensionCount) + dimension];

    /// <summary>What the stop collects in the dimension.</summary>
    public double Pickup(int stop, int dimension) => PickupFlat[(stop * DimensionCount) + dimension];

    /// <summary>What the stop's delivery takes from the depot: its demand, or 0 for the delivery end of a pair.</summary>
    public double DepotLoad(int stop, int dimension) => PartnerOf[stop] >= 0 && Stops[stop].CollectFrom >= 0 ? 0 : Demand(stop, dimension);

    /// <summary>The other stop of the stop's pair, or -1 when it is in none.</summary>
    public int Partner(int stop) => PartnerOf[stop];

    /// <summary>True for the collection end of a pair.</summary>
    public bool IsCollection(int stop) => PartnerOf[stop] >= 0 && Stops[stop].CollectFrom < 0;

    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveInlining)]
    public double Capacity(int vehicle, int dimension) => CapacityFlat[(vehicle * DimensionCount) + dimension];

    public double ServiceTime(int stop) => Service[stop];

    public double UnservedPrice(int stop)
    {
        double own = Stops[stop].UnservedPenalty;
        return double.IsNaN(own) ? Rules.Unserved.Price : own;
    }

    /// <summary>May this stop be left out without breaking a hard rule?</summary>
    public bool MayDrop(int stop) => Stops[stop].Optional || !Rules.Unserved.Hard;

    /// <summary>Earliest opening and latest closing over the stop's windows.</summary>
    public TimeWindow Hull(int stop)
    {
        int a = WindowOffset[stop];
        int b = WindowOffset[stop + 1] - 1;
        return new TimeWindow(WindowOpen[a], WindowClose[b]);
    }

    /// <summary>Same instance with another objective or rule set (used by benchmarks and tests).</summary>
    public Instance With(Objective? objective = null, RuleSet? rules = null, IReadOnlyList<Vehicle>? vehicles = null) =>
        new(Name, Stops, Depots, vehicles ?? Vehicles, DimensionNames, EquipmentNames, rules ?? Rules, objective ?? Objective, Travel, Units) { LatLon = LatLon };

    /// <summary>Stops and depots hold degrees: <see cref="Stop.X"/> is the longitude, <see cref="Stop.Y"/> the latitude (WGS 84).</summary>
    public bool LatLon { get; init; }
}
