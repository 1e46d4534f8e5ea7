using System.Text;

namespace Anneal.Experiments.Summary;

/// <summary>summary.md: plain GitHub-flavoured Markdown, pictures linked beside it.</summary>
public static class MarkdownSummary
{
    public const string FileName = "summary.md";

    public static string Render(SummaryDocument doc)
    {
        var b = new StringBuilder();
        b.Append("# ").AppendLine(doc.Title).AppendLine();
        foreach (var line in doc.Lead)
        {
            b.AppendLine(line).AppendLine();
        }

        foreach (var section in doc.Sections)
        {
            b.Append("## ").AppendLine(section.Heading).AppendLine();
            foreach (var p in section.Paragraphs)
            {
                b.AppendLine(p).AppendLine();
            }

            if (section.Table is { } t)
            {
                b.Append("| ").AppendJoin(" | ", t.Headers.Select(Cell)).AppendLine(" |");
                b.Append('|').AppendJoin('|', t.Numeric.Select(n => n ? "---:" : "---")).AppendLine("|");
                foreach (var row in t.Rows)
                {
                    b.Append("| ").AppendJoin(" | ", row.Select(Cell)).AppendLine(" |");
                }

                b.AppendLine();
            }

            foreach (var pic in section.Pictures ?? [])
            {
                b.Append("![").Append(pic.Caption).Append("](").Append(pic.Stem).AppendLine(".png)").AppendLine();
                b.Append('*').Append(pic.Caption).Append("* (also [").Append(pic.Stem).Append(".svg](").Append(pic.Stem).AppendLine(".svg))").AppendLine();
            }
        }

        return b.ToString();
    }

    private static string Cell(string text) => text.Replace("|", "\\|", StringComparison.Ordinal);
}
