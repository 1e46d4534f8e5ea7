using System.Text;
using Anneal.Formats.Input;
using CsCheck;

namespace Anneal.Tests.Formats.Input.Csv;

/// <summary>Random damage to a valid job must give a valid instance or an InputException, never anything else.</summary>
public class CsvJobFuzzTests
{
    internal static readonly string[] Files = ["stops.csv", "depots.csv", "vehicles.csv", "matrix.csv", "settings.json"];

    private static readonly string[] Garbage =
        ["", "-1", "25:99", "abc", "\"", "1e999", "NaN", "99999999999", "08:00-", ";", "\u00e9\u00e8", "\u0000", "47:59", "-", "1,2", "{", "}", "yes", "hub", "cold"];

    internal static readonly Gen<(int File, int Kind, int A, int B)> Mutation =
        Gen.Select(Gen.Int[0, Files.Length - 1], Gen.Int[0, 9], Gen.Int[0, 400], Gen.Int[0, 400]);

    [Fact]
    [Trait("Category", FuzzBudget.Category)]
    public void Mutated_jobs_load_or_fail_with_located_problems()
    {
        // One fixed seed and many cases in one sample keeps the test deterministic (project rule) yet broad.
        Mutation.Array[1, 3].Array[FuzzBudget.Cases(150)].Sample(cases =>
        {
            using var job = new JobFolder(new Dictionary<string, string>());
            foreach (var mutations in cases)
            {
                var files = Base();
                foreach (var m in mutations)
                {
                    Apply(files, m);
                }

                foreach (var name in Files)
                {
                    var path = Path.Combine(job.Path, name);
                    if (files.TryGetValue(name, out var bytes))
                    {
                        File.WriteAllBytes(path, bytes);
                    }
                    else
                    {
                        File.Delete(path);
                    }
                }

                try
                {
                    CsvJobReader.Read(job.Path);
                }
                catch (InputException e)
                {
                    Assert.NotEmpty(e.Problems);
                    Assert.All(e.Problems, p =>
                    {
                        Assert.Contains(p.File, Files);
                        Assert.False(string.IsNullOrWhiteSpace(p.Problem));
                        Assert.True(p.Row is null or >= 1);
                    });
                }
            }
        }, iter: 1, threads: 1, seed: "0N0XIzNsQ0O2");
    }

    internal static Dictionary<string, byte[]> Base()
    {
        var text = JobFolder.ValidPlanar();
        text["matrix.csv"] = "from,to,distance,duration\nhub,s1,5,10\nhub,s2,10,20\nhub,s3,10,20\ns1,s2,5,10\ns1,s3,6.7,13\ns2,s3,6.3,0:13\n";
        var result = new Dictionary<string, byte[]>();
        foreach (var (k, v) in text)
        {
            result[k] = Encoding.UTF8.GetBytes(v);
        }

        return result;
    }

    internal static void Apply(Dictionary<string, byte[]> files, (int File, int Kind, int A, int B) m)
    {
        var name = Files[m.File];
        if (!files.TryGetValue(name, out var bytes))
        {
            return;
        }

        var text = Encoding.UTF8.GetString(bytes);
        var lines = text.Split('\n').ToList();
        int a = lines.Count == 0 ? 0 : m.A % lines.Count;
        int b = lines.Count == 0 ? 0 : m.B % lines.Count;
        switch (m.Kind)
        {
            case 0: lines.RemoveAt(a); break;
            case 1: lines.Insert(b, lines[a]); break;
            case 2: (lines[a], lines[b]) = (lines[b], lines[a]); break;
            case 3:
                var cells = lines[a].Split(',');
                cells[m.B % cells.Length] = Garbage[m.B % Garbage.Length];
                lines[a] = string.Join(',', cells);
                break;
            case 4: lines[a] = lines[a].Insert(m.B % (lines[a].Length + 1), "\""); break;
            case 5: files[name] = bytes[..(m.A * 7 % (bytes.Length + 1))]; return;
            case 6: files[name] = [0xEF, 0xBB, 0xBF, .. bytes]; return;
            case 7: files[name] = Encoding.UTF8.GetBytes(text.Replace("\n", "\r\n", StringComparison.Ordinal)); return;
            case 8: files[name] = [.. bytes[..(m.A % (bytes.Length + 1))], (byte)(m.B % 256), .. bytes[(m.A % (bytes.Length + 1))..]]; return;
            default: files.Remove(name); return;
        }

        files[name] = Encoding.UTF8.GetBytes(string.Join('\n', lines));
    }
}
