namespace Anneal.Formats.Input.Csv;

/// <summary>One data record with the physical line it starts on (the header is line 1).</summary>
internal sealed record CsvRow(int Line, string[] Cells);
