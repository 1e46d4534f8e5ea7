namespace Anneal.Tests.Formats.Input.Csv;

/// <summary>A CSV job written into a fresh temporary folder, deleted on dispose.</summary>
internal sealed class JobFolder : IDisposable
{
    public string Path { get; }

    public JobFolder(IReadOnlyDictionary<string, string> files, string name = "job")
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "anneal-csv-" + Guid.NewGuid().ToString("N"), name);
        Directory.CreateDirectory(Path);
        foreach (var (file, text) in files)
        {
            File.WriteAllText(System.IO.Path.Combine(Path, file), text);
        }
    }

    public void Write(string file, byte[] bytes) => File.WriteAllBytes(System.IO.Path.Combine(Path, file), bytes);

    public void Dispose()
    {
        try
        {
            Directory.Delete(System.IO.Path.GetDirectoryName(Path)!, recursive: true);
        }
        catch (IOException)
        {
            // a leftover temp folder is harmless
        }
    }

    /// <summary>A small valid planar job: two dimensions, equipment, multiple windows, optional stops, vehicle counts.</summary>
    public static Dictionary<string, string> ValidPlanar() => new()
    {
        ["stops.csv"] =
            "id,x,y,demand_kg,demand_m3,service,windows,needs,optional,penalty,note\n" +
            "s1,3,4,10,1.5,0:10,08:00-10:30;14:00-16:00,,no,,first\n" +
            "s2,6,8,20,,15,09:00-12:00,Cold,yes,90,\n" +
            "s3,0,10,5,0.5,,,,,,\"quoted, with comma\"\n",
        ["depots.csv"] = "id,x,y\nhub,0,0\n",
        ["vehicles.csv"] =
            "id,count,depot,capacity_kg,capacity_m3,shift_start,shift_end,max_duration,fixed_cost,cost_per_km,cost_per_hour,equipment\n" +
            "van,2,hub,100,8,07:30,26:15,8:00,50,0.4,22,\n" +
            "fridge,1,hub,80,6,08:00,18:00,,70,0.5,25,cold;lift\n",
        ["settings.json"] =
            "{\n  // comments are allowed\n  \"objective\": \"distance\",\n  \"timeSeconds\": 12,\n  \"solvers\": [\"sa\", \"tabu\"],\n  \"seed\": 7,\n" +
            "  \"travel\": { \"speedKmh\": 30 },\n" +
            "  \"rules\": { \"timeWindows\": { \"hard\": false, \"pricePerMinute\": 2.5 }, \"unserved\": { \"hard\": false, \"pricePerStop\": 250 }, },\n}\n",
    };
}
