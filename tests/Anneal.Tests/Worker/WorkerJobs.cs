using System.Globalization;
using System.Text;

namespace Anneal.Tests.Worker;

/// <summary>Small CSV jobs written in code (10 stops around one depot) and dropped into an inbox by rename.</summary>
internal static class WorkerJobs
{
    /// <summary>A valid job; the seed varies the stops so that jobs differ.</summary>
    public static void DropValid(string root, string name, int seed) => Drop(root, name, Stops(seed), Vehicles());

    /// <summary>A valid job whose settings.json gives its own search budget and solver.</summary>
    public static void DropValid(string root, string name, int seed, double timeSeconds, string solver) =>
        Drop(root, name, Stops(seed), Vehicles(), "{ \"timeSeconds\": " + timeSeconds.ToString(CultureInfo.InvariantCulture) + ", \"solvers\": [\"" + solver + "\"] }");

    /// <summary>stops.csv row 3 has a demand that is not a number.</summary>
    public static void DropBadDemand(string root, string name)
    {
        var lines = Stops(7).Split('\n');
        lines[2] = lines[2].Replace(",12,", ",lots,", StringComparison.Ordinal);
        Drop(root, name, string.Join('\n', lines), Vehicles());
    }

    /// <summary>vehicles.csv row 2 has a shift start that is no time of day.</summary>
    public static void DropBadShift(string root, string name) =>
        Drop(root, name, Stops(8), Vehicles().Replace("07:00", "7 o'clock", StringComparison.Ordinal));

    /// <summary>The files of a valid job (10 stops), by name.</summary>
    public static Dictionary<string, string> ValidFiles(int seed) => new()
    {
        ["depots.csv"] = "id,x,y\nD,0,0\n",
        ["stops.csv"] = Stops(seed),
        ["vehicles.csv"] = Vehicles(),
    };

    /// <summary>A valid job written as the folder <paramref name="folder"/> (for `anneal queue submit`).</summary>
    public static string WriteValid(string folder, int seed) => Write(folder, Stops(seed), Vehicles());

    /// <summary>Like <see cref="DropBadDemand"/>, written as the folder <paramref name="folder"/>.</summary>
    public static string WriteBadDemand(string folder)
    {
        var lines = Stops(7).Split('\n');
        lines[2] = lines[2].Replace(",12,", ",lots,", StringComparison.Ordinal);
        return Write(folder, string.Join('\n', lines), Vehicles());
    }

    /// <summary>Writes the job in a staging folder, then renames it into the inbox so the worker never sees half a job.</summary>
    private static void Drop(string root, string name, string stops, string vehicles, string? settings = null)
    {
        string staging = Write(Path.Combine(root, "staging", name), stops, vehicles);
        if (settings is not null)
        {
            File.WriteAllText(Path.Combine(staging, "settings.json"), settings);
        }

        Directory.CreateDirectory(Path.Combine(root, "inbox"));
        Directory.Move(staging, Path.Combine(root, "inbox", name));
    }

    private static string Write(string folder, string stops, string vehicles)
    {
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "depots.csv"), "id,x,y\nD,0,0\n");
        File.WriteAllText(Path.Combine(folder, "stops.csv"), stops);
        File.WriteAllText(Path.Combine(folder, "vehicles.csv"), vehicles);
        return folder;
    }

    private static string Stops(int seed)
    {
        var random = new Random(seed);
        var b = new StringBuilder("id,x,y,demand_kg,service,windows\n");
        for (int i = 1; i <= 10; i++)
        {
            double x = Math.Round((random.NextDouble() * 20) - 10, 2);
            double y = Math.Round((random.NextDouble() * 20) - 10, 2);
            b.Append(CultureInfo.InvariantCulture, $"S{i:00},{x},{y},12,5,\n");
        }

        return b.ToString();
    }

    private static string Vehicles() => "id,count,capacity_kg,shift_start,shift_end,fixed_cost,cost_per_km,cost_per_hour\nvan,3,60,07:00,17:00,40,0.3,20\n";
}
