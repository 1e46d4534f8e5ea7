using Anneal.Core.Model;

namespace Anneal.Formats.Input;

/// <summary>An instance read from disk, with the settings that came with it and which format it was.</summary>
/// <param name="Format">"csv-job", "workbook", "solomon", "lilim" or "cvrplib".</param>
public sealed record LoadedInput(Instance Instance, JobSettings Settings, string Format, string Path)
{
    /// <summary>How the files were read, in words for `check` (e.g. "semicolon-separated, decimal commas"); null for text formats.</summary>
    public string? ReadAs { get; init; }

    /// <summary>What was read and accepted but may not be what the user meant (e.g. a matrix pair given one way only), for `check`.</summary>
    public IReadOnlyList<string> Warnings { get; init; } = [];
}
