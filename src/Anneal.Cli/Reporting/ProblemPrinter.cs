using Anneal.Formats.Input;

namespace Anneal.Cli.Reporting;

/// <summary>Prints input problems one per line, grouped by file (and workbook sheet) in the order they were first mentioned.</summary>
public static class ProblemPrinter
{
    public static void Print(TextWriter writer, IReadOnlyList<InputProblem> problems)
    {
        var files = new List<string>();
        var byFile = new Dictionary<string, List<InputProblem>>(StringComparer.Ordinal);
        foreach (var p in problems)
        {
            string file = p.Sheet is null ? p.File : $"{p.File}, sheet '{p.Sheet}'";
            if (!byFile.TryGetValue(file, out var list))
            {
                list = [];
                byFile[file] = list;
                files.Add(file);
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
