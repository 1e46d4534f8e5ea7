namespace Anneal.Experiments.Summary;

/// <summary>A table of text cells; <paramref name="Numeric"/> marks the columns to align right.</summary>
public sealed record SummaryTable(IReadOnlyList<string> Headers, IReadOnlyList<IReadOnlyList<string>> Rows, IReadOnlyList<bool> Numeric);

/// <summary>A picture: file stem (PNG and SVG beside the summary), caption, and the PNG bytes to embed in HTML.</summary>
public sealed record SummaryPicture(string Stem, string Caption, byte[] Png);

/// <summary>A part of the summary: heading, paragraphs, then optionally a table and pictures.</summary>
public sealed record SummarySection(string Heading, IReadOnlyList<string> Paragraphs, SummaryTable? Table = null, IReadOnlyList<SummaryPicture>? Pictures = null);

/// <summary>The experiment summary as content, rendered the same way to Markdown and to HTML.</summary>
public sealed record SummaryDocument(string Title, IReadOnlyList<string> Lead, IReadOnlyList<SummarySection> Sections);
