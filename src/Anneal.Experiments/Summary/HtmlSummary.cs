using System.Net;
using System.Text;

namespace Anneal.Experiments.Summary;

/// <summary>summary.html: one self-contained page (pictures embedded as PNG data) to open, print or paste from.</summary>
public static class HtmlSummary
{
    public const string FileName = "summary.html";

    private const string Css = """
        body { font: 15px/1.45 "DejaVu Sans", "Segoe UI", Helvetica, Arial, sans-serif; color: #1d2733; margin: 0 auto; max-width: 1100px; padding: 24px 28px 48px; }
        h1 { font-size: 26px; margin: 0 0 8px; }
        h2 { font-size: 19px; margin: 30px 0 10px; padding-bottom: 4px; border-bottom: 2px solid #d5dbe1; }
        p.lead { color: #5b6672; margin: 4px 0; }
        table { border-collapse: collapse; width: 100%; margin: 6px 0 10px; }
        th, td { text-align: left; padding: 4px 8px; border-bottom: 1px solid #d5dbe1; }
        th { background: #f3f5f7; font-size: 13px; }
        td.n, th.n { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
        figure { margin: 10px 0 18px; break-inside: avoid; }
        figure img { width: 100%; height: auto; border: 1px solid #d5dbe1; }
        figcaption { color: #5b6672; font-size: 13px; }
        """;

    public static string Render(SummaryDocument doc)
    {
        var b = new StringBuilder();
        b.AppendLine("<!DOCTYPE html>").AppendLine("<html lang=\"en\"><head><meta charset=\"utf-8\">");
        b.Append("<title>").Append(E(doc.Title)).AppendLine("</title>");
        b.Append("<style>").Append(Css).AppendLine("</style></head><body>");
        b.Append("<h1>").Append(E(doc.Title)).AppendLine("</h1>");
        foreach (var line in doc.Lead)
        {
            b.Append("<p class=\"lead\">").Append(E(line)).AppendLine("</p>");
        }

        foreach (var section in doc.Sections)
        {
            b.Append("<h2>").Append(E(section.Heading)).AppendLine("</h2>");
            foreach (var p in section.Paragraphs)
            {
                b.Append("<p>").Append(E(p)).AppendLine("</p>");
            }

            if (section.Table is { } t)
            {
                b.Append("<table><thead><tr>");
                for (int i = 0; i < t.Headers.Count; i++)
                {
                    b.Append(t.Numeric[i] ? "<th class=\"n\">" : "<th>").Append(E(t.Headers[i])).Append("</th>");
                }

                b.AppendLine("</tr></thead><tbody>");
                foreach (var row in t.Rows)
                {
                    b.Append("<tr>");
                    for (int i = 0; i < row.Count; i++)
                    {
                        b.Append(t.Numeric[i] ? "<td class=\"n\">" : "<td>").Append(E(row[i])).Append("</td>");
                    }

                    b.AppendLine("</tr>");
                }

                b.AppendLine("</tbody></table>");
            }

            foreach (var pic in section.Pictures ?? [])
            {
                b.Append("<figure><img alt=\"").Append(E(pic.Caption)).Append("\" src=\"data:image/png;base64,").Append(Convert.ToBase64String(pic.Png))
                    .Append("\"><figcaption>").Append(E(pic.Caption)).AppendLine("</figcaption></figure>");
            }
        }

        b.AppendLine("</body></html>");
        return b.ToString();
    }

    private static string E(string text) => WebUtility.HtmlEncode(text);
}
