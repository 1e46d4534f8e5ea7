using Anneal.Formats.Input.Csv;

namespace Anneal.Formats.Input;

/// <summary>
/// Reads a CSV job folder (stops.csv, depots.csv, vehicles.csv, optional matrix.csv and settings.json) into an
/// instance. Every file is checked in full and all problems are reported together in one <see cref="InputException"/>.
/// </summary>
public static class CsvJobReader
{
    public const string Format = "csv-job";

    /// <exception cref="InputException">with every problem found in the folder's files.</exception>
    public static LoadedInput Read(string folder)
    {
        var problems = new ProblemList();
        if (!Directory.Exists(folder))
        {
            problems.Add(folder, null, null, null, "no such folder", "give the path of a folder holding stops.csv, depots.csv and vehicles.csv");
            problems.ThrowIfAny();
        }

        var settings = ReadSettings(folder, problems);
        var tables = new JobTables(
            Table(folder, DepotsTable.FileName, required: true, problems),
            Table(folder, VehiclesTable.FileName, required: true, problems),
            Table(folder, StopsTable.FileName, required: true, problems),
            Table(folder, MatrixTable.FileName, required: false, problems),
            settings);
        string name = Path.GetFileName(Path.TrimEndingDirectorySeparator(Path.GetFullPath(folder)));
        var instance = JobAssembler.Assemble(name, tables, problems);
        return new LoadedInput(instance, tables.Settings.Job, Format, folder) { ReadAs = JobAssembler.ReadAs(tables), Warnings = problems.Warnings };
    }

    private static SettingsFile ReadSettings(string folder, ProblemList problems)
    {
        var path = Path.Combine(folder, SettingsFile.FileName);
        if (!File.Exists(path))
        {
            return new SettingsFile();
        }

        var bytes = ReadBytes(path, SettingsFile.FileName, problems);
        return bytes is null ? new SettingsFile() : SettingsFile.Read(bytes, problems);
    }

    private static CsvTable? Table(string folder, string file, bool required, ProblemList problems)
    {
        var path = Path.Combine(folder, file);
        if (!File.Exists(path))
        {
            if (required)
            {
                problems.Add(file, null, null, null, "the file is missing", $"add {file} to the job folder (names are lower case)");
            }

            return null;
        }

        var bytes = ReadBytes(path, file, problems);
        if (bytes is null)
        {
            return null;
        }

        var text = CsvText.Decode(bytes, out bool legacy);
        var table = CsvTable.Parse(text, file, problems);
        return table is null || !legacy ? table : table with { Encoding = CsvText.LegacyName };
    }

    private static byte[]? ReadBytes(string path, string file, ProblemList problems)
    {
        try
        {
            return File.ReadAllBytes(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            problems.Add(file, null, null, null, "the file cannot be read: " + FileTrouble.Reading(path, e), "check that the file is not locked and may be read");
            return null;
        }
    }
}
