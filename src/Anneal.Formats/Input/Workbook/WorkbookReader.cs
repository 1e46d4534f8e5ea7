using Anneal.Formats.Input.Csv;

namespace Anneal.Formats.Input.Workbook;

/// <summary>
/// Reads an .xlsx workbook that holds a job as sheets named like the CSV files: <c>stops</c>, <c>depots</c>,
/// <c>vehicles</c>, optional <c>matrix</c> and <c>settings</c>. Each sheet is read like its CSV file; other sheets are
/// left alone. Problems name the sheet, row, column and cell.
/// </summary>
public static class WorkbookReader
{
    public const string Format = "workbook";

    public static bool LooksLike(string path) =>
        path.EndsWith(".xlsx", StringComparison.OrdinalIgnoreCase) || path.EndsWith(".xlsm", StringComparison.OrdinalIgnoreCase);

    /// <exception cref="InputException">with every problem found in the workbook's sheets.</exception>
    public static LoadedInput Read(string path)
    {
        var problems = new ProblemList();
        string file = Path.GetFileName(path);
        var sheets = SheetTables.Read(path, file, problems);
        problems.ThrowIfAny();

        var settingsSheet = Find(sheets!, SettingsSheet.Name, required: false, file, problems);
        var settings = settingsSheet is null ? new SettingsFile() : SettingsSheet.Read(settingsSheet, problems);
        var tables = new JobTables(
            Find(sheets!, "depots", required: true, file, problems),
            Find(sheets!, "vehicles", required: true, file, problems),
            Find(sheets!, "stops", required: true, file, problems),
            Find(sheets!, "matrix", required: false, file, problems),
            settings);
        var instance = JobAssembler.Assemble(Path.GetFileNameWithoutExtension(path), tables, problems);
        var used = new List<string>();
        foreach (var t in new[] { tables.Stops, tables.Depots, tables.Vehicles, tables.Matrix, settingsSheet })
        {
            if (t is not null)
            {
                used.Add(t.Sheet!);
            }
        }

        return new LoadedInput(instance, settings.Job, Format, path) { ReadAs = "sheets " + string.Join(", ", used), Warnings = problems.Warnings };
    }

    private static CsvTable? Find(List<CsvTable> sheets, string name, bool required, string file, ProblemList problems)
    {
        foreach (var sheet in sheets)
        {
            if (string.Equals(sheet.Sheet!.Trim(), name, StringComparison.OrdinalIgnoreCase))
            {
                if (sheet.Header.Count == 0)
                {
                    problems.Add(new InputProblem(file, null, null, null, "the sheet is empty", "put the column names in row 1 and one record per row below")
                    {
                        Sheet = sheet.Sheet,
                    });
                    return null;
                }

                return sheet;
            }
        }

        if (required)
        {
            var names = sheets.Select(s => s.Sheet!).ToList();
            var near = Closest.Find(name, names);
            problems.Add(file, null, null, null, $"no sheet named '{name}' (the workbook has {string.Join(", ", names.Select(n => "'" + n + "'"))})",
                (near is not null ? $"did you mean '{near}'? " : string.Empty) + $"name the sheet '{name}'; a job workbook has sheets stops, depots and vehicles (optional matrix, settings)");
        }

        return null;
    }
}
