using Anneal.Formats.Input;

namespace Anneal.Cli.Reporting;

/// <summary>Prints input problems one per line, grouped by file in the order the files were first mentioned.</summary>
public static class ProblemPrinter
{
    public static void Print(TextWriter writer, IReadOnlyList<InputProblem> problems)
    {
        var files = new List<string>();
        var byFile = new Dictionary<string, List<InputProblem>>(StringComparer.Ordinal);
        foreach (var p in problems)
        {
            if (!byFile.TryGetValue(p.File, out var list))
            {
                list = [];
                byFile[p.File] = list;
                files.Add(p.File);
            }

            list.Add(p);
        }

        foreach (var file in files)
        {
            var list = byFile[file];
            writer.WriteLine($"{file}: {Count(list.Count)}");
            foreach (var p in list)
            {
                writer.WriteLine("  " + p);
            }
        }

        writer.WriteLine(problems.Count == 0 ? "The input is not valid." : $"The input is not valid: {Count(problems.Count)} in total.");
    }

    private static string Count(int n) => n == 1 ? "1 problem" : $"{n} problems";
}
