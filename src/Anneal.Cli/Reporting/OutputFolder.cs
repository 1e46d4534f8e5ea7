using System.Globalization;
using System.Text;
using Anneal.Formats.Output;

namespace Anneal.Cli.Reporting;

/// <summary>Chooses and creates the folder a run writes to.</summary>
public static class OutputFolder
{
    /// <summary>runs/&lt;instance&gt;-&lt;yyyyMMdd-HHmmss&gt; under <paramref name="baseDirectory"/>; a suffix keeps two runs in one second apart.</summary>
    public static string Default(string baseDirectory, string instanceName, DateTime now)
    {
        string stem = Path.Combine(baseDirectory, "runs", $"{Safe(instanceName)}-{now.ToString("yyyyMMdd-HHmmss", CultureInfo.InvariantCulture)}");
        string path = stem;
        for (int n = 2; Directory.Exists(path) || File.Exists(path); n++)
        {
            path = $"{stem}-{n}";
        }

        return path;
    }

    /// <exception cref="OutputException">when the folder cannot be created.</exception>
    public static string Create(string path)
    {
        try
        {
            return Directory.CreateDirectory(path).FullName;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            throw OutputException.ForFolder(path, e);
        }
    }

    private static string Safe(string name)
    {
        var invalid = Path.GetInvalidFileNameChars();
        var b = new StringBuilder(name.Length);
        foreach (char c in name)
        {
            b.Append(char.IsWhiteSpace(c) || Array.IndexOf(invalid, c) >= 0 ? '-' : c);
        }

        return b.Length == 0 ? "instance" : b.ToString();
    }
}
