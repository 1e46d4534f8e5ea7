using Anneal.Formats.Input.Workbook;

namespace Anneal.Formats.Input;

/// <summary>Front door for reading any supported input: a CSV job folder, a workbook (.xlsx) or a benchmark file, detected from content.</summary>
public static class InputLoader
{
    /// <exception cref="InputException">with every problem found.</exception>
    public static LoadedInput Load(string path)
    {
        if (Directory.Exists(path))
        {
            return CsvJobReader.Read(path);
        }

        if (!File.Exists(path))
        {
            throw new InputException(new InputProblem(path, null, null, null,
                "there is no file or folder at this path", Nearby(path) + "give the path of a CSV job folder, an .xlsx workbook, a Solomon or Li & Lim .txt file or a CVRPLIB .vrp file"));
        }

        if (WorkbookReader.LooksLike(path))
        {
            return WorkbookReader.Read(path);
        }

        if (path.EndsWith(".xls", StringComparison.OrdinalIgnoreCase) || path.EndsWith(".ods", StringComparison.OrdinalIgnoreCase))
        {
            throw new InputException(new InputProblem(path, null, null, null, "this spreadsheet format is not read (only .xlsx workbooks are)",
                "save the workbook as .xlsx (Excel workbook), or export its sheets as CSV files into a job folder"));
        }

        string text;
        try
        {
            text = File.ReadAllText(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InputException(new InputProblem(path, null, null, null, "the file cannot be read: " + FileTrouble.Reading(path, e), "check the path and its permissions"));
        }

        if (CvrplibReader.LooksLike(text))
        {
            return new LoadedInput(CvrplibReader.Parse(text, path), new JobSettings { Objective = Core.Model.Objective.Distance }, "cvrplib", path);
        }

        if (SolomonReader.LooksLike(text))
        {
            return new LoadedInput(SolomonReader.Parse(text, path), new JobSettings { Objective = Core.Model.Objective.Distance }, "solomon", path);
        }

        if (LiLimReader.LooksLike(text))
        {
            return new LoadedInput(LiLimReader.Parse(text, path), new JobSettings { Objective = Core.Model.Objective.VehiclesThenDistance }, "lilim", path);
        }

        if (Path.GetFileName(path).ToLowerInvariant() is "stops.csv" or "depots.csv" or "vehicles.csv" or "matrix.csv" or "settings.json")
        {
            throw new InputException(new InputProblem(path, null, null, null, "this is one file of a CSV job; a job is read as a whole folder",
                "give the folder that holds it: " + (Path.GetDirectoryName(path) is { Length: > 0 } d ? d : ".")));
        }

        throw new InputException(new InputProblem(path, 1, null, null,
            "the format is not recognised (neither a Solomon VRPTW file, a Li & Lim pickup-and-delivery file nor a CVRPLIB/TSPLIB .vrp file)",
            "give a CSV job folder, a Solomon text file (VEHICLE and CUSTOMER sections), a Li & Lim file (a line of 3 numbers, then 9 per task) or a CVRPLIB file (NODE_COORD_SECTION)"));
    }

    /// <summary>"did you mean 'marl-valley'? " when the folder above holds a name close to the one typed.</summary>
    private static string Nearby(string path)
    {
        try
        {
            var full = Path.GetFullPath(path);
            var parent = Path.GetDirectoryName(Path.TrimEndingDirectorySeparator(full));
            if (parent is null || !Directory.Exists(parent))
            {
                return string.Empty;
            }

            var near = Closest.Find(Path.GetFileName(Path.TrimEndingDirectorySeparator(full)), Directory.EnumerateFileSystemEntries(parent).Select(Path.GetFileName).OfType<string>());
            return near is null ? string.Empty : $"did you mean '{Path.Combine(Path.GetDirectoryName(Path.TrimEndingDirectorySeparator(path)) ?? string.Empty, near)}'? Or ";
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException)
        {
            return string.Empty;
        }
    }
}
